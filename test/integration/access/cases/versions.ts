// Access cases for the gait page, versions, review steps, the comparison and the versions API.
import { and, desc, eq } from "drizzle-orm";
import { gaitVersions, gaits, mailOutbox, type VersionState } from "../../../../db/schema";
import { type DemoIds, act, load } from "../../../support/routes";
import { changeDraft } from "../../../support/drafts";
import { uniqueName } from "../../../support/names";
import type { Caller } from "../../../support/routes";
import type { RouteCase } from "../support";
import { commitDraft } from "~/features/versions/versions.server";
import * as apiVersions from "~/routes/api.v1/gaits/versions";
import * as compare from "~/routes/gaits/compare";
import * as gaitPage from "~/routes/gaits/gait";
import * as gaitList from "~/routes/gaits/list";
import * as versionPage from "~/routes/gaits/version";

// A gait without error flags, so approving needs no override reason.
const GAIT = "Wave climb";

type Db = Parameters<NonNullable<RouteCase["prepare"]>>[0];

/** A fresh version of the gait by the animator (its draft changed first: an unchanged one is not committed), moved straight to `state` (reviewer: the lead). */
async function versionIn(db: Db, ids: DemoIds, state: VersionState) {
  const gaitId = ids.gaitIds[GAIT];
  await changeDraft(db, gaitId);
  const version = await commitDraft({ userId: ids.userIds.animator, workspaceId: ids.workspaceId }, gaitId, uniqueName("Matrix version"), db);
  if (state !== "committed") await db.update(gaitVersions).set({ state, reviewerId: ids.userIds.lead }).where(eq(gaitVersions.id, version.id));
  return { gaitId, number: String(version.number), versionId: version.id };
}

/** A version in review whose review-request mail, sent by `caller`, failed: what "Send again" acts on. */
async function failedMail(db: Db, ids: DemoIds, caller: Caller) {
  const version = await versionIn(db, ids, "in-review");
  const [mail] = await db
    .insert(mailOutbox)
    .values({
      workspaceId: ids.workspaceId,
      senderId: caller === "signed-out" ? null : ids.userIds[caller],
      topic: "review-request",
      targetType: "gait_version",
      targetId: version.versionId,
      to: "reviewer@example.test",
      subject: "Review requested",
      body: "Please review.",
      state: "failed",
      attempts: 3,
      failedAt: new Date(),
    })
    .returning({ id: mailOutbox.id });
  return { ...version, mailId: mail.id };
}

async function draftState(db: Db, ids: DemoIds) {
  const gaitId = ids.gaitIds[GAIT];
  const [gait] = await db.select({ draftRevision: gaits.draftRevision }).from(gaits).where(eq(gaits.id, gaitId));
  const [first] = await db
    .select({ id: gaitVersions.id })
    .from(gaitVersions)
    .where(and(eq(gaitVersions.gaitId, gaitId), eq(gaitVersions.number, 1)));
  return { gaitId, draftRevision: String(gait.draftRevision), versionId: first.id };
}

async function twoVersions(db: Db, ids: DemoIds) {
  const rows = await db
    .select({ id: gaitVersions.id })
    .from(gaitVersions)
    .where(eq(gaitVersions.gaitId, ids.gaitIds[GAIT]))
    .orderBy(desc(gaitVersions.number))
    .limit(2);
  return { a: rows[1].id, b: rows[0].id };
}

const versionStep = (intent: string, state: VersionState, fields: (ids: DemoIds) => Record<string, string> = () => ({})) =>
  ({
    route: "routes/gaits/version.tsx",
    kind: "action",
    intent,
    prepare: (db, ids) => versionIn(db, ids, state),
    run: (req, ids, { gaitId, number }) =>
      req("POST", `/gaits/${gaitId}/versions/${number}`, { form: { intent, ...fields(ids) } }).then((r) => act(versionPage, r, { gaitId, number })),
  }) satisfies Partial<RouteCase>;

export const cases: RouteCase[] = [
  {
    name: "GET /gaits?robot=:robotId (one robot's gaits)",
    route: "routes/gaits/list.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/gaits?robot=${ids.robotIds["Hull climber"]}`).then((r) => load(gaitList, r)),
  },
  {
    name: "GET /gaits/:gaitId (versions, sorted and filtered)",
    route: "routes/gaits/gait.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/gaits/${ids.gaitIds[GAIT]}?sort=margin&dir=asc&flags=clean`).then((r) => load(gaitPage, r, { gaitId: ids.gaitIds[GAIT] })),
  },
  {
    name: "POST /gaits/:gaitId (commit the draft)",
    route: "routes/gaits/gait.tsx",
    kind: "action",
    intent: "commit",
    // Each caller commits a draft changed for them: a draft equal to the newest version is refused.
    prepare: (db, ids) => changeDraft(db, ids.gaitIds[GAIT]).then(() => ({})),
    run: (req, ids) =>
      req("POST", `/gaits/${ids.gaitIds[GAIT]}`, { form: { intent: "commit", message: uniqueName("Matrix commit") } }).then((r) =>
        act(gaitPage, r, { gaitId: ids.gaitIds[GAIT] }),
      ),
  },
  {
    name: "POST /gaits/:gaitId (start a new draft from a version)",
    route: "routes/gaits/gait.tsx",
    kind: "action",
    intent: "restore",
    prepare: draftState,
    run: (req, _ids, { gaitId, versionId, draftRevision }) =>
      req("POST", `/gaits/${gaitId}`, { form: { intent: "restore", versionId, draftRevision } }).then((r) => act(gaitPage, r, { gaitId })),
  },
  {
    name: "GET /gaits/:gaitId/versions/:number",
    route: "routes/gaits/version.tsx",
    kind: "loader",
    run: (req, ids) => req("GET", `/gaits/${ids.gaitIds[GAIT]}/versions/1`).then((r) => load(versionPage, r, { gaitId: ids.gaitIds[GAIT], number: "1" })),
  },
  {
    name: "POST /gaits/:gaitId/versions/:number (request review)",
    ...versionStep("request-review", "committed", (ids) => ({ reviewerId: ids.userIds.lead, comment: "Please look" })),
  },
  { name: "POST /gaits/:gaitId/versions/:number (approve)", ...versionStep("approve", "in-review") },
  {
    name: "POST /gaits/:gaitId/versions/:number (send back)",
    ...versionStep("send-back", "in-review", () => ({ comment: "Lift the rear legs higher" })),
  },
  { name: "POST /gaits/:gaitId/versions/:number (release)", ...versionStep("release", "approved") },
  {
    name: "POST /gaits/:gaitId/versions/:number (send a failed mail again)",
    route: "routes/gaits/version.tsx",
    kind: "action",
    intent: "resend-mail",
    prepare: failedMail,
    run: (req, _ids, { gaitId, number, mailId }) =>
      req("POST", `/gaits/${gaitId}/versions/${number}`, { form: { intent: "resend-mail", mailId } }).then((r) => act(versionPage, r, { gaitId, number })),
  },
  {
    name: "GET /gaits/compare?a=&b=",
    route: "routes/gaits/compare.tsx",
    kind: "loader",
    prepare: twoVersions,
    run: (req, _ids, { a, b }) => req("GET", `/gaits/compare?a=${a}&b=${b}`).then((r) => load(compare, r)),
  },
  {
    name: "GET /api/v1/gaits/:gaitId/versions",
    route: "routes/api.v1/gaits/versions.ts",
    kind: "loader",
    run: (req, ids) => req("GET", `/api/v1/gaits/${ids.gaitIds[GAIT]}/versions`).then((r) => load(apiVersions, r, { gaitId: ids.gaitIds[GAIT] })),
  },
];
