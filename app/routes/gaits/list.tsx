import type { Route } from "./+types/list";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
import { listGaits } from "~/lib/gaits.server";
import { requireAccess } from "~/lib/access.server";

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace } = await requireAccess(request, "gaits.read");
  return { gaits: await listGaits(workspace.id) };
}

export const meta: Route.MetaFunction = () => [{ title: "Gaits · Gaitloom" }];

export default function GaitList({ loaderData }: Route.ComponentProps) {
  const { gaits } = loaderData;
  return (
    <>
      <PageHeader title="Gaits" lead="Walks, turns and body moves, with their committed versions." />
      {gaits.length === 0 ? (
        <EmptyState title="No gaits yet">Pick a robot and start a gait from a template such as tripod or wave.</EmptyState>
      ) : (
        <table className="w-full border-collapse rounded-lg bg-surface text-left">
          <thead className="border-b border-line text-sm text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-medium">Gait</th>
              <th className="px-4 py-2 font-medium">Robot</th>
              <th className="px-4 py-2 text-right font-medium">Versions</th>
              <th className="px-4 py-2 text-right font-medium">Newest</th>
              <th className="px-4 py-2 text-right font-medium">Released</th>
            </tr>
          </thead>
          <tbody>
            {gaits.map((gait) => (
              <tr key={gait.id} className="border-b border-line last:border-0">
                <td className="px-4 py-2 font-medium">{gait.name}</td>
                <td className="px-4 py-2">{gait.robotName}</td>
                <td className="px-4 py-2 text-right">{gait.versionCount}</td>
                <td className="px-4 py-2 text-right">{gait.latestVersion ?? "—"}</td>
                <td className="px-4 py-2 text-right">{gait.releasedVersion ?? "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
