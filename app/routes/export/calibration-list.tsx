// /export/calibration: the robots, each with its calibration profiles (one per physical unit).
import { Link } from "react-router";
import type { Route } from "./+types/calibration-list";
import { EmptyState } from "~/components/common/EmptyState";
import { ErrorPanel } from "~/components/common/ErrorPanel";
import { PageHeader } from "~/components/common/PageHeader";
import { requireAccess } from "~/platform/access.server";
import { robotsWithProfiles } from "~/features/robots/calibration.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "robots.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace } = await requireAccess(request, permissions.loader);
  return { robots: await robotsWithProfiles(workspace.id) };
}

export const meta: Route.MetaFunction = () => [{ title: "Calibration profiles · Gaitloom" }];

export default function CalibrationList({ loaderData }: Route.ComponentProps) {
  return (
    <>
      <PageHeader
        title="Calibration profiles"
        lead="Each physical unit of a robot — named, say, by its serial number — with its own servo trims, reversals and channels, applied when a table is exported."
      />
      {loaderData.robots.length === 0 ? (
        <EmptyState title="No robots yet">Add a robot first.</EmptyState>
      ) : (
        <ul className="divide-y divide-line rounded-lg border border-line bg-surface">
          {loaderData.robots.map((robot) => (
            <li key={robot.id} className="flex items-center justify-between px-4 py-3">
              <Link to={`/export/calibration/${robot.id}`} className="font-medium text-accent underline underline-offset-2">
                {robot.name}
              </Link>
              <span className="numeric text-sm text-ink-muted">
                {robot.profiles} profile{robot.profiles === 1 ? "" : "s"}
              </span>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPanel error={error} />;
}
