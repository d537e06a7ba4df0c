import { useFetcher } from "react-router";
import type { Route } from "./+types/robot";
import { PageHeader } from "~/components/common/PageHeader";
import { ArchiveControls } from "~/components/archive/ArchiveControls";
import { DownloadRevisionLink, RevisionHistory } from "~/components/robots/RevisionHistory";
import { formatTime } from "~/platform/format";
import { RobotEditor } from "~/components/robots/RobotForm";
import { requireAccess } from "~/platform/access.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { readFormWithin } from "~/platform/body.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { robotParams } from "~/features/robots/params";
import type { SaveRefusalDetails, SavedRevision } from "~/features/robots/results";
import { saveFromForm, SAVE_BODY_LIMIT_BYTES } from "~/features/robots/save.server";
import { loadRobotPage } from "./robot-page.server";

const NOT_FOUND = "There is no robot at this address in your workspace.";

export { saveForm as actionForm } from "~/features/robots/params";

// Firmware may save changes to servo mapping and calibration only: saveRevision
// asks for robots.edit as well when the definition changes anything else.
export const permissions = { loader: "robots.read", action: { save: "robots.calibrate" } } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { member, robot } = await loadRobotPage(request, permissions.loader, robotParams, params, NOT_FOUND);
  const { role } = member;
  return {
    robot,
    mode: can(role, "robots.edit") ? ("edit" as const) : can(role, "robots.calibrate") ? ("calibrate" as const) : ("read" as const),
    archive: { archive: can(role, "robots.edit"), delete: can(role, "robots.delete") },
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const member = await requireAccess(request, permissions.action.save);
  return formAction<SavedRevision, SaveRefusalDetails>(async () => {
    const parsed = robotParams.safeParse(params);
    if (!parsed.success) throw new ServiceError(404, "not-found", NOT_FOUND);
    return saveFromForm(await readFormWithin(request, SAVE_BODY_LIMIT_BYTES), { member, robotId: parsed.data.robotId });
  });
}

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `${loaderData?.robot.name ?? "Robot"} · Robots · Gaitloom` }];

export default function RobotPage({ loaderData }: Route.ComponentProps) {
  const { robot, mode, archive } = loaderData;
  const latest = robot.latest;
  const saveFetcher = useFetcher<typeof action>();
  return (
    <>
      <PageHeader
        title={robot.name}
        lead={`Revision ${latest.number}, saved ${formatTime(latest.createdAt)}${latest.author ? ` by ${latest.author.name}` : ""}. ${latest.definition.legs.length} legs.`}
      >
        <DownloadRevisionLink robotId={robot.id} number={latest.number} />
        <ArchiveControls kind="robot" id={robot.id} name={robot.name} archivedAt={robot.archivedAt} can={archive} />
      </PageHeader>
      {mode === "read" ? (
        <p className="mb-4 rounded-lg border border-line bg-sunken px-4 py-3 text-sm text-ink-muted">You can read this robot; your role cannot change it.</p>
      ) : null}
      {/* A new revision (our save or someone else's, on reload) starts a fresh working copy. */}
      <RobotEditor key={latest.number} robotId={robot.id} initial={latest.definition} baseRevision={latest.number} mode={mode} saveFetcher={saveFetcher} />
      <RevisionHistory robotId={robot.id} revisions={robot.revisions} current={latest.number} />
    </>
  );
}

export { RouteErrorBoundary as ErrorBoundary } from "~/components/common/ErrorPanel";
