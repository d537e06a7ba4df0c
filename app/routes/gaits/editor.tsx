// /gaits/:gaitId/edit: the gait editor on the working draft. Everyone who may
// read gaits sees it (read-only without gaits.edit); saving goes through
// PUT /api/v1/gaits/:gaitId/draft, committing posts to /gaits/:gaitId.
import { data } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/editor";
import { EditorScreen } from "~/components/editor/EditorScreen";
import { requireAccess } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { moveDraftToNewestRobot, readDraft } from "~/features/gaits/drafts.server";
import { ServiceError, formAction, pageGuard } from "~/platform/errors.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { draftRevision, id } from "~/platform/params";

const gaitParams = z.object({ gaitId: id("There is no gait at this address.") });

function gaitIdOf(params: unknown): string {
  const parsed = gaitParams.safeParse(params);
  if (!parsed.success) throw data({ message: parsed.error.issues[0].message }, { status: 404 });
  return parsed.data.gaitId;
}

export const permissions = { loader: "gaits.read", action: { "move-to-newest-robot": "gaits.edit" } } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace, role } = await requireAccess(request, permissions.loader);
  const gaitId = gaitIdOf(params);
  return pageGuard(async () => {
    const draft = await readDraft(workspace.id, gaitId);
    return {
      gait: draft.gait,
      robot: draft.robot,
      sequence: draft.sequence,
      revision: draft.revision,
      updatedAt: draft.updatedAt,
      updatedBy: draft.updatedBy,
      robotRevision: draft.robotRevision,
      newestRobotRevision: draft.newestRobotRevision,
      can: { edit: can(role, "gaits.edit"), commit: can(role, "versions.commit") },
    };
  });
}

export const actionForm = z.object({
  intent: z.literal("move-to-newest-robot", { error: "Unknown request." }),
  baseRevision: draftRevision((issue) => `baseRevision must be the draft revision, a whole number (got ${JSON.stringify(issue.input ?? null)})`),
});

export async function action({ request, params }: Route.ActionArgs) {
  const { user, workspace } = await requireAccess(request, permissions.action["move-to-newest-robot"]);
  const gaitId = gaitIdOf(params);
  return formAction(async () => {
    const parsed = actionForm.safeParse(Object.fromEntries(await readForm(request)));
    if (!parsed.success) throw new ServiceError(400, "bad-request", parsed.error.issues[0].message);
    const moved = await moveDraftToNewestRobot({ userId: user.id, workspaceId: workspace.id }, gaitId, parsed.data.baseRevision);
    return { ok: true as const, ...moved };
  });
}

export const meta: Route.MetaFunction = ({ data: loaded }) => [{ title: `${loaded?.gait.name ?? "Gait"} · Editor · Gaitloom` }];

export default function GaitEditor({ loaderData }: Route.ComponentProps) {
  const { gait, robot, sequence, revision, updatedAt, robotRevision, newestRobotRevision, can: allowed } = loaderData;
  return (
    // A new robot revision is a new robot: the editor starts afresh on it.
    <EditorScreen
      key={robotRevision.id}
      gait={gait}
      robot={robot}
      sequence={sequence}
      revision={revision}
      updatedAt={updatedAt}
      robotRevision={robotRevision.number}
      newestRobotRevision={newestRobotRevision.number}
      canEdit={allowed.edit}
      canCommit={allowed.commit}
    />
  );
}

export { RouteErrorBoundary as ErrorBoundary } from "~/components/common/ErrorPanel";
