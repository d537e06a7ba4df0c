import { Form, Link, redirect, useNavigation } from "react-router";
import type { Route } from "./+types/revision";
import { PageHeader } from "~/components/common/PageHeader";
import { DownloadRevisionLink, RevisionHistory } from "~/components/robots/RevisionHistory";
import { formatTime } from "~/platform/format";
import { RobotEditor } from "~/components/robots/RobotForm";
import { requireAccess } from "~/platform/access.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { readFormWithin } from "~/platform/body.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { revisionParams } from "~/features/robots/params";
import { restoreFromForm } from "~/features/robots/save.server";
import { getRevision } from "~/features/robots/robots.server";
import { loadRobotPage, notFoundPage } from "./robot-page.server";

const NOT_FOUND = "There is no such robot revision in your workspace.";

export { restoreForm as actionForm } from "~/features/robots/params";

// As saving: restoring a revision that differs from the newest beyond servo
// mapping and calibration needs robots.edit too (saveRevision checks).
export const permissions = { loader: "robots.read", action: { restore: "robots.calibrate" } } satisfies RoutePermissions;

export async function loader({ request, params }: Route.LoaderArgs) {
  const { member, address, robot } = await loadRobotPage(request, permissions.loader, revisionParams, params, NOT_FOUND);
  const found = await getRevision(member.workspace.id, address.robotId, address.number);
  if (!found) throw notFoundPage(NOT_FOUND);
  return {
    robot: found.robot,
    revision: found.revision,
    latestNumber: found.latestNumber,
    revisions: robot.revisions,
    canRestore: can(member.role, "robots.calibrate"),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const member = await requireAccess(request, permissions.action.restore);
  return formAction(async () => {
    const parsed = revisionParams.safeParse(params);
    if (!parsed.success) throw new ServiceError(404, "not-found", NOT_FOUND);
    const body = await readFormWithin(request, 16 * 1024);
    if (!body.ok) throw body.tooLarge ? new ServiceError(413, "too-large", "The request is too large.") : body.refusal;
    await restoreFromForm(body.form, { member, robotId: parsed.data.robotId, number: parsed.data.number });
    return redirect(`/robots/${parsed.data.robotId}`);
  });
}

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData ? `${loaderData.robot.name}, revision ${loaderData.revision.number} · Gaitloom` : "Robot revision · Gaitloom" },
];

export default function RevisionPage({ loaderData, actionData }: Route.ComponentProps) {
  const { robot, revision, latestNumber, revisions, canRestore } = loaderData;
  const navigation = useNavigation();
  const restoring = navigation.state === "submitting" && navigation.formData?.get("intent") === "restore";
  const newest = revision.number === latestNumber;
  return (
    <>
      <PageHeader
        title={`${robot.name}, revision ${revision.number}`}
        lead={`Saved ${formatTime(revision.createdAt)}${revision.author ? ` by ${revision.author.name}` : ""}: ${revision.message || "(no message)"}`}
      >
        <Link to={`/robots/${robot.id}`} className="rounded-md border border-line bg-surface px-3 py-1.5 text-sm font-medium hover:bg-sunken">
          Back to the robot
        </Link>
        <DownloadRevisionLink robotId={robot.id} number={revision.number} />
      </PageHeader>
      <div className="mb-4 flex flex-wrap items-center gap-3 rounded-lg border border-line bg-sunken px-4 py-3 text-sm">
        <span>{newest ? "This is the newest revision." : `An old revision, read only. The newest is revision ${latestNumber}.`}</span>
        {canRestore && !newest ? (
          <Form method="post">
            <input type="hidden" name="intent" value="restore" />
            <input type="hidden" name="baseRevision" value={latestNumber} />
            <button
              type="submit"
              disabled={restoring}
              className="rounded-md bg-accent px-3 py-1 font-medium text-on-accent hover:bg-accent-strong disabled:opacity-50"
            >
              {restoring ? "Restoring…" : `Restore as revision ${latestNumber + 1}`}
            </button>
          </Form>
        ) : null}
      </div>
      {actionData ? (
        <p role="alert" className="mb-4 rounded-md border border-danger bg-danger-soft p-3 text-sm text-danger">
          <span aria-hidden>⚠ </span>
          {actionData.error}
        </p>
      ) : null}
      <RobotEditor key={revision.number} robotId={robot.id} initial={revision.definition} baseRevision={latestNumber} mode="read" />
      <RevisionHistory robotId={robot.id} revisions={revisions} current={revision.number} />
    </>
  );
}

export { RouteErrorBoundary as ErrorBoundary } from "~/components/common/ErrorPanel";
