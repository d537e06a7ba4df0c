import { data, Form, Link, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/version";
import { Notice } from "~/components/common/Notice";
import { PageHeader } from "~/components/common/PageHeader";
import { FlagGroupsTable } from "~/components/versions/FlagGroupsTable";
import { ReviewActions } from "~/components/versions/ReviewActions";
import { ReviewHistory } from "~/components/versions/ReviewHistory";
import { SentMailList } from "~/components/versions/SentMailList";
import { useFreshWhile } from "~/components/common/useFreshWhile";
import { StateBadge } from "~/components/versions/StateBadge";
import { VersionFacts } from "~/components/versions/VersionFacts";
import { formatTime } from "~/platform/format";
import { requireAccess } from "~/platform/access.server";
import { groupFlags } from "~/features/compare";
import { formAction, ServiceError, type FormError } from "~/platform/errors.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { id, versionNumber } from "~/platform/params";
import { readIntentForm } from "~/platform/intent-form.server";
import { mailSentAbout, resendMail } from "~/platform/outbox.server";
import { approvalRules, approveVersion, releaseVersion, requestReview, reviewersFor, sendBackVersion } from "~/features/versions/review.server";
import { getGait, getVersion, listVersions, solveVersion } from "~/features/versions/versions.server";
import { checkReleaseTable } from "~/features/tables/index.server";
import { ReleaseTableCheck } from "~/components/export/ReleaseTableCheck";

const versionParams = z.object({
  gaitId: id(),
  number: versionNumber(),
});

const notFound = () => data({ message: "There is no such version of a gait in your workspace." }, { status: 404 });

const text = z.string().optional().default("");

export const actionForm = z.discriminatedUnion("intent", [
  z.object({
    intent: z.literal("request-review"),
    reviewerId: id("Choose who should review this version."),
    compareWithId: z
      .union([id(), z.literal("")])
      .optional()
      .default(""),
    comment: text,
  }),
  z.object({ intent: z.literal("approve"), comment: text, overrideReason: text }),
  z.object({ intent: z.literal("send-back"), comment: text }),
  z.object({ intent: z.literal("release"), comment: text }),
  z.object({ intent: z.literal("resend-mail"), mailId: id("That is not an e-mail of this version.") }),
]);

type Intent = z.infer<typeof actionForm>["intent"];

export const permissions = {
  loader: "gaits.read",
  action: {
    "request-review": "versions.requestReview",
    approve: "versions.decide",
    "send-back": "versions.decide",
    release: "versions.release",
    // Whoever sent a version's mail took one of the steps above, all open to this permission; the service checks the sender.
    "resend-mail": "versions.requestReview",
  },
} satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace, role, user } = await requireAccess(request, permissions.loader);
  const parsed = versionParams.safeParse(params);
  if (!parsed.success) throw notFound();
  const [version, gait] = await Promise.all([getVersion(workspace.id, parsed.data.gaitId, parsed.data.number), getGait(workspace.id, parsed.data.gaitId)]);
  if (!version || !gait) throw notFound();
  const [solved, reviewers, siblings, mails, releaseCheck] = await Promise.all([
    solveVersion(version),
    reviewersFor(workspace.id, version.author?.id ?? null),
    listVersions(workspace.id, gait.id),
    mailSentAbout({ type: "gait_version", id: version.id }, user.id),
    // Today's table beside the one the release recorded (a solve, as a download is).
    checkReleaseTable(version.id),
  ]);
  const others = siblings.filter((sibling) => sibling.id !== version.id).map(({ id, number, message, state }) => ({ id, number, message, state }));
  const previous = others.filter((other) => other.number < version.number).sort((x, y) => y.number - x.number)[0] ?? null;
  const released = others.find((other) => other.state === "released") ?? null;
  const { sequence: _sequence, ...shown } = version;
  return {
    version: shown,
    gait: { id: gait.id, name: gait.name, robot: gait.robot, draftRevision: gait.draft.revision },
    flagGroups: groupFlags(solved.solved.flags),
    reviewers,
    others,
    previousId: previous?.id ?? null,
    releasedId: released?.id ?? null,
    // What the signed-in person's review steps mailed, and how it went.
    mails,
    releaseTable: releaseCheck && {
      ...releaseCheck,
      downloadPath: can(role, "tables.download") ? `/api/v1/gaits/${gait.id}/versions/${version.number}/table?${releaseCheck.recorded.tableFormat}` : null,
    },
    approval: approvalRules({ authorId: version.author?.id ?? null, errors: version.errors }, { userId: user.id, role }),
    can: {
      requestReview: can(role, "versions.requestReview"),
      decide: can(role, "versions.decide"),
      release: can(role, "versions.release"),
      edit: can(role, "gaits.edit"),
    },
  };
}

export type VersionActionData = { ok: true; intent: Intent; notice: string } | FormError;

/**
 * POST /gaits/:gaitId/versions/:number
 *   intent=request-review, reviewerId, compareWithId?, comment?
 *   intent=approve, comment?, overrideReason?
 *   intent=send-back, comment
 *   intent=release, comment?
 *   intent=resend-mail, mailId (a failed mail the signed-in person sent about this version)
 */
export async function action({ request, params }: Route.ActionArgs) {
  const mailNote = (mails: number, whom: string) => (mails === 0 ? "" : mails === 1 ? ` E-mail to ${whom}: queued.` : ` E-mails to ${mails} people: queued.`);
  return formAction(async (): Promise<VersionActionData> => {
    const { member, form: input } = await readIntentForm(request, actionForm, permissions.action);
    const parsed = versionParams.safeParse(params);
    const version = parsed.success ? await getVersion(member.workspace.id, parsed.data.gaitId, parsed.data.number) : null;
    if (!version) throw new ServiceError(404, "not-found", "There is no such version of a gait in your workspace.");
    switch (input.intent) {
      case "request-review": {
        const outcome = await requestReview(member, version.id, {
          reviewerId: input.reviewerId,
          comment: input.comment,
          compareWithId: input.compareWithId || null,
        });
        return { ok: true, intent: input.intent, notice: `Review requested from ${outcome.reviewer}.${mailNote(outcome.mails, outcome.reviewer)}` };
      }
      case "approve": {
        const outcome = await approveVersion(member, version.id, { comment: input.comment, overrideReason: input.overrideReason });
        const override = outcome.override.length > 0 ? " with an override, recorded in the audit log" : "";
        return { ok: true, intent: input.intent, notice: `Version ${version.number} approved${override}.${mailNote(outcome.mails, "the author")}` };
      }
      case "send-back": {
        const outcome = await sendBackVersion(member, version.id, { comment: input.comment });
        return { ok: true, intent: input.intent, notice: `Version ${version.number} sent back.${mailNote(outcome.mails, "the author")}` };
      }
      case "release": {
        const outcome = await releaseVersion(member, version.id, { comment: input.comment });
        const retired = outcome.retired ? ` Version ${outcome.retired} is now retired.` : "";
        return { ok: true, intent: input.intent, notice: `Version ${version.number} released.${retired}${mailNote(outcome.mails, "the author")}` };
      }
      case "resend-mail": {
        const mail = await resendMail(member, input.mailId, { type: "gait_version", id: version.id });
        return { ok: true, intent: input.intent, notice: `E-mail to ${mail.to}: queued again.` };
      }
    }
  });
}

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData ? `${loaderData.gait.name} v${loaderData.version.number} · Gaitloom` : "Gait version · Gaitloom" },
];

export default function VersionPage({ loaderData, actionData }: Route.ComponentProps) {
  // The job runner sends the mail after the answer: follow it until it is out.
  const {
    version,
    gait,
    flagGroups,
    reviewers,
    others,
    previousId,
    releasedId,
    mails,
    releaseTable,
    approval,
    can: allowed,
  } = useFreshWhile(loaderData, (data) => data.mails.some((mail) => mail.state === "queued"));
  const navigation = useNavigation();
  const busy = navigation.state === "submitting" ? String(navigation.formData?.get("intent") ?? "") : null;
  const result = actionData as VersionActionData | undefined;
  const error = result && "error" in result ? result : null;
  const success = result && "ok" in result ? result : null;
  return (
    <>
      <PageHeader
        title={`${gait.name} v${version.number}`}
        lead={`${gait.robot.name} · committed ${formatTime(version.createdAt)}${version.author ? ` by ${version.author.name}` : ""}`}
      >
        <Link to={`/gaits/${gait.id}`} className="rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken">
          All versions
        </Link>
        {previousId ? (
          <Link
            to={`/gaits/compare?a=${previousId}&b=${version.id}`}
            className="rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken"
          >
            Compare with the previous version
          </Link>
        ) : null}
        {releasedId ? (
          <Link
            to={`/gaits/compare?a=${releasedId}&b=${version.id}`}
            className="rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken"
          >
            Compare with the released version
          </Link>
        ) : null}
      </PageHeader>
      <Notice success={success?.notice} />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-6">
          <section aria-labelledby="version-heading" className="rounded-lg border border-line bg-surface p-4">
            <div className="flex items-center justify-between gap-3">
              <h2 id="version-heading" className="text-lg font-semibold">
                “{version.message}”
              </h2>
              <StateBadge state={version.state} />
            </div>
            <VersionFacts version={version} />
          </section>
          {releaseTable ? <ReleaseTableCheck check={releaseTable} /> : null}
          <section aria-labelledby="checks-heading" className="space-y-2">
            <h2 id="checks-heading" className="text-lg font-semibold">
              Checks
            </h2>
            <FlagGroupsTable groups={flagGroups} />
          </section>
          <section aria-labelledby="history-heading" className="space-y-2">
            <h2 id="history-heading" className="text-lg font-semibold">
              Review history
            </h2>
            <ReviewHistory events={version.events} />
          </section>
        </div>
        <aside className="space-y-4" aria-label="Review">
          <ReviewActions
            version={{ id: version.id, number: version.number, state: version.state, errors: version.errors, reviewer: version.reviewer }}
            reviewers={reviewers}
            others={others}
            defaultCompareWith={previousId ?? releasedId}
            approval={approval}
            can={allowed}
            busy={busy}
            error={error}
            succeeded={success?.intent ?? null}
          />
          <SentMailList mails={mails} busy={busy === "resend-mail"} />
          {allowed.edit ? (
            <Form method="post" action={`/gaits/${gait.id}`} className="rounded-lg border border-line bg-surface p-4 text-sm">
              <input type="hidden" name="intent" value="restore" />
              <input type="hidden" name="versionId" value={version.id} />
              <input type="hidden" name="draftRevision" value={gait.draftRevision} />
              <p className="mb-2 text-ink-muted">Copies this version's sequence and robot revision into the working draft, to edit or commit again.</p>
              <button
                type="submit"
                disabled={busy === "restore"}
                className="rounded-md border border-line bg-surface px-3 py-1.5 font-medium hover:bg-sunken disabled:opacity-60"
              >
                Start a new draft from v{version.number}
              </button>
            </Form>
          ) : null}
        </aside>
      </div>
    </>
  );
}

export { RouteErrorBoundary as ErrorBoundary } from "~/components/common/ErrorPanel";
