import { data, Link, useNavigation } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/gait";
import { Notice } from "~/components/common/Notice";
import { PageHeader } from "~/components/common/PageHeader";
import { ArchiveControls } from "~/components/archive/ArchiveControls";
import { DraftPanel } from "~/components/versions/DraftPanel";
import { VersionFilters } from "~/components/versions/VersionFilters";
import { VersionTable } from "~/components/versions/VersionTable";
import { parseVersionQuery } from "~/components/versions/version-query";
import { requireAccess } from "~/platform/access.server";
import { formAction, ServiceError, type FormError } from "~/platform/errors.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { draftRevision, id } from "~/platform/params";
import { readIntentForm } from "~/platform/intent-form.server";
import { commitDraft, getGait, listVersions, restoreDraft, versionAuthors } from "~/features/versions/versions.server";

const gaitParams = z.object({ gaitId: id() });

const notFound = () => data({ message: "There is no gait at this address in your workspace." }, { status: 404 });

const revisionField = draftRevision("draftRevision must be the draft revision the page showed");

export const actionForm = z.discriminatedUnion("intent", [
  z.object({
    intent: z.literal("commit"),
    message: z.string({ error: "Describe the version." }),
    draftRevision: revisionField.optional(),
  }),
  z.object({
    intent: z.literal("restore"),
    versionId: id("Choose the version to start the draft from."),
    draftRevision: revisionField,
  }),
]);

export const permissions = { loader: "gaits.read", action: { commit: "versions.commit", restore: "gaits.edit" } } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace, role } = await requireAccess(request, permissions.loader);
  const parsed = gaitParams.safeParse(params);
  if (!parsed.success) throw notFound();
  const gait = await getGait(workspace.id, parsed.data.gaitId);
  if (!gait) throw notFound();
  const query = parseVersionQuery(new URL(request.url).searchParams);
  const [versions, authors, all] = await Promise.all([
    listVersions(workspace.id, gait.id, query),
    versionAuthors(workspace.id, gait.id),
    listVersions(workspace.id, gait.id),
  ]);
  return {
    gait,
    versions,
    // For the comparison picker: every version, whatever the filter shows.
    allVersions: all.map(({ id, number, message }) => ({ id, number, message })),
    authors,
    query,
    can: { commit: can(role, "versions.commit"), edit: can(role, "gaits.edit"), delete: can(role, "gaits.delete") },
  };
}

export type GaitActionData =
  { ok: true; intent: "commit" | "restore"; notice: string; version?: { id: string; number: number; contentHash: string }; draftRevision?: number } | FormError;

/**
 * POST /gaits/:gaitId
 *   intent=commit, message, draftRevision? → the draft becomes the next version (the editor posts this too)
 *   intent=restore, versionId, draftRevision → the draft starts over from that version
 * Answers { ok: true, intent, notice, … } or { error, field } with the refusal's status.
 */
export async function action({ request, params }: Route.ActionArgs) {
  return formAction(async (): Promise<GaitActionData> => {
    const { member, form } = await readIntentForm(request, actionForm, permissions.action);
    const parsed = gaitParams.safeParse(params);
    if (!parsed.success) throw new ServiceError(404, "not-found", "There is no gait at this address in your workspace.");
    const gaitId = parsed.data.gaitId;
    const committer = { userId: member.user.id, workspaceId: member.workspace.id };
    if (form.intent === "commit") {
      const version = await commitDraft(committer, gaitId, form.message, undefined, { draftRevision: form.draftRevision });
      return { ok: true, intent: "commit", notice: `Committed version ${version.number}.`, version };
    }
    const restored = await restoreDraft(committer, gaitId, form.versionId, form.draftRevision);
    return {
      ok: true,
      intent: "restore",
      notice: `The working draft now starts from version ${restored.number} (draft revision ${restored.draftRevision}). Edit it, or commit it as it is.`,
      draftRevision: restored.draftRevision,
    };
  });
}

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `${loaderData?.gait.name ?? "Gait"} · Gaits · Gaitloom` }];

export default function GaitPage({ loaderData, actionData }: Route.ComponentProps) {
  const { gait, versions, allVersions, authors, query, can: allowed } = loaderData;
  const navigation = useNavigation();
  const busyIntent = navigation.state === "submitting" ? String(navigation.formData?.get("intent") ?? "") : null;
  const result = actionData as GaitActionData | undefined;
  const error = result && "error" in result ? result : null;
  const success = result && "ok" in result ? result : null;
  // A restore answers with the new draft revision; use it at once, so a commit sent before the page's data reloads is not refused as stale.
  const draftRevision = Math.max(gait.draft.revision, success?.draftRevision ?? 0);
  return (
    <>
      <PageHeader
        title={gait.name}
        lead={`${gait.robot.name} · ${gait.versionCount} version${gait.versionCount === 1 ? "" : "s"}${gait.releasedVersion ? ` · version ${gait.releasedVersion} released` : " · nothing released yet"}${gait.description ? ` · ${gait.description}` : ""}`}
      >
        <Link to={`/gaits?robot=${gait.robot.id}`} className="rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken">
          Gaits of {gait.robot.name}
        </Link>
        {allowed.edit ? (
          <Link to={`/gaits/${gait.id}/edit`} className="rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-on-accent hover:bg-accent-strong">
            Edit the draft
          </Link>
        ) : null}
        <ArchiveControls kind="gait" id={gait.id} name={gait.name} archivedAt={gait.archivedAt} can={{ archive: allowed.edit, delete: allowed.delete }} />
      </PageHeader>
      <Notice error={error && error.field !== "message" ? error.error : null} success={success?.notice} />
      <DraftPanel
        gait={gait}
        draftRevision={draftRevision}
        canCommit={allowed.commit}
        committing={busyIntent === "commit"}
        messageError={error?.field === "message" ? error.error : null}
        // A successful commit clears the message box.
        resetKey={success?.intent === "commit" ? success.version?.id : undefined}
      />
      <section className="mt-8 space-y-3" aria-labelledby="versions-heading">
        <div className="flex flex-wrap items-end justify-between gap-3">
          <h2 id="versions-heading" className="text-lg font-semibold">
            Versions
          </h2>
          <VersionFilters query={query} authors={authors} />
        </div>
        <VersionTable
          gaitId={gait.id}
          rows={versions}
          allVersions={allVersions}
          query={query}
          canRestore={allowed.edit}
          draftRevision={draftRevision}
          restoring={busyIntent === "restore" ? String(navigation.formData?.get("versionId")) : null}
        />
      </section>
    </>
  );
}

export { RouteErrorBoundary as ErrorBoundary } from "~/components/common/ErrorPanel";
