import type { Route } from "./+types/list";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
import { listRobots } from "~/lib/robots.server";
import { requireAccess } from "~/lib/access.server";

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace } = await requireAccess(request, "robots.read");
  return { robots: await listRobots(workspace.id) };
}

export const meta: Route.MetaFunction = () => [{ title: "Robots · Gaitloom" }];

export default function RobotList({ loaderData }: Route.ComponentProps) {
  const { robots } = loaderData;
  return (
    <>
      <PageHeader title="Robots" lead="Each robot's legs, joint limits and servo wiring. Every save is kept as a revision." />
      {robots.length === 0 ? (
        <EmptyState title="No robots yet">Add a robot by uploading its definition or importing a URDF file.</EmptyState>
      ) : (
        <table className="w-full border-collapse overflow-hidden rounded-lg bg-surface text-left">
          <thead className="border-b border-line text-sm text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-medium">Name</th>
              <th className="px-4 py-2 text-right font-medium">Legs</th>
              <th className="px-4 py-2 text-right font-medium">Revision</th>
              <th className="px-4 py-2 text-right font-medium">Last saved</th>
            </tr>
          </thead>
          <tbody>
            {robots.map((robot) => (
              <tr key={robot.id} className="border-b border-line last:border-0">
                <td className="px-4 py-2 font-medium">{robot.name}</td>
                <td className="px-4 py-2 text-right">{robot.legCount}</td>
                <td className="px-4 py-2 text-right">{robot.latestRevision}</td>
                <td className="px-4 py-2 text-right">{new Date(robot.updatedAt).toISOString().slice(0, 10)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
