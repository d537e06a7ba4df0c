// GET /api/v1/gaits/:gaitId/draft → the working draft and its revision.
// PUT /api/v1/gaits/:gaitId/draft { sequence, baseRevision } → { revision, updatedAt };
// 409 when someone saved since baseRevision, 422 with issues when the sequence
// is invalid or does not fit the robot. Nothing is saved on either refusal.
import { z } from "zod";
import type { Route } from "./+types/draft";
import { requireApiAccess } from "~/platform/access.server";
import { idParam } from "~/platform/params";
import { readJsonBody } from "~/platform/body.server";
import { DRAFT_BODY_LIMIT_BYTES, readDraft, saveDraft, type DraftContext } from "~/features/gaits/drafts.server";
import { apiAction, apiError, methodNotAllowed } from "~/platform/errors.server";
import type { RoutePermissions } from "~/platform/permissions";

const gaitParams = z.object({ gaitId: idParam("gaitId") });

function gaitIdOf(params: unknown): string {
  const parsed = gaitParams.safeParse(params);
  if (!parsed.success) throw apiError(400, "bad_request", parsed.error.issues[0].message);
  return parsed.data.gaitId;
}

export const draftJson = (draft: DraftContext) => ({
  gaitId: draft.gaitId,
  name: draft.gait.name,
  revision: draft.revision,
  updatedAt: draft.updatedAt,
  updatedBy: draft.updatedBy,
  robot: { id: draft.gait.robotId, name: draft.gait.robotName, revision: draft.robotRevision.number, newestRevision: draft.newestRobotRevision.number },
  sequence: draft.sequence,
});

const noStore = { "Cache-Control": "no-store" };

export const permissions = { loader: "gaits.read", action: "gaits.edit" } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { workspace } = await requireApiAccess(request, permissions.loader);
  const gaitId = gaitIdOf(params);
  return apiAction(async () => Response.json(draftJson(await readDraft(workspace.id, gaitId)), { headers: noStore }));
}

export async function action({ request, params }: Route.ActionArgs) {
  if (request.method !== "PUT") return methodNotAllowed(request.method, ["GET", "HEAD", "PUT"]);
  const { user, workspace } = await requireApiAccess(request, permissions.action);
  const gaitId = gaitIdOf(params);
  const body = await readJsonBody(request, DRAFT_BODY_LIMIT_BYTES);
  return apiAction(async () => Response.json(await saveDraft({ userId: user.id, workspaceId: workspace.id }, gaitId, body), { headers: noStore }));
}
