import { Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/list";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
import { StateBadge } from "~/components/versions/StateBadge";
import { requireAccess } from "~/platform/access.server";
import { listGaits } from "~/features/gaits/gaits.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { id } from "~/platform/params";
import { listRobots } from "~/features/robots/robots.server";

const listQuery = z.object({ robot: id().optional().catch(undefined) });

export const permissions = { loader: "gaits.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace, role } = await requireAccess(request, permissions.loader);
  const { robot } = listQuery.parse({ robot: new URL(request.url).searchParams.get("robot") || undefined });
  const robots = await listRobots(workspace.id);
  const chosen = robot ? (robots.find((candidate) => candidate.id === robot) ?? null) : null;
  return {
    gaits: await listGaits(workspace.id, chosen ? { robotId: chosen.id } : {}),
    robots: robots.map(({ id, name }) => ({ id, name })),
    robot: chosen ? { id: chosen.id, name: chosen.name } : null,
    unknownRobot: Boolean(robot && !chosen),
    canCreate: can(role, "gaits.edit"),
  };
}

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData?.robot ? `Gaits of ${loaderData.robot.name} · Gaitloom` : "Gaits · Gaitloom" },
];

export default function GaitList({ loaderData }: Route.ComponentProps) {
  const { gaits, robots, robot, unknownRobot, canCreate } = loaderData;
  return (
    <>
      <PageHeader title={robot ? `Gaits of ${robot.name}` : "Gaits"} lead="Walks, turns and body moves, each with its newest and its released version.">
        <Form method="get" className="flex items-end gap-2" key={robot?.id ?? "all"}>
          <div className="flex flex-col gap-0.5 text-xs text-ink-muted">
            <label htmlFor="gaits-robot-filter">Robot</label>
            <select
              id="gaits-robot-filter"
              name="robot"
              defaultValue={robot?.id ?? ""}
              className="rounded-md border border-line bg-canvas px-2 py-1 text-sm text-ink"
            >
              <option value="">All robots</option>
              {robots.map((candidate) => (
                <option key={candidate.id} value={candidate.id}>
                  {candidate.name}
                </option>
              ))}
            </select>
          </div>
          <button type="submit" className="rounded-md border border-line bg-surface px-3 py-1 text-sm font-medium hover:bg-sunken">
            Show
          </button>
        </Form>
        {canCreate ? (
          <Link
            to={robot ? `/gaits/new?robot=${robot.id}` : "/gaits/new"}
            className="self-end rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-on-accent hover:bg-accent-strong"
          >
            New gait
          </Link>
        ) : null}
      </PageHeader>
      {unknownRobot ? <p className="mb-4 rounded-md bg-sunken px-4 py-2 text-sm">That robot is not in this workspace; showing every robot's gaits.</p> : null}
      {gaits.length === 0 ? (
        <EmptyState title={robot ? `No gaits for ${robot.name} yet` : "No gaits yet"}>
          Pick a robot and start a gait from a template such as tripod or wave.
        </EmptyState>
      ) : (
        <table className="w-full border-collapse rounded-lg bg-surface text-left" aria-label={robot ? `Gaits of ${robot.name}` : "Gaits"}>
          <thead className="border-b border-line text-sm text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-medium">Gait</th>
              <th className="px-4 py-2 font-medium">Robot</th>
              <th className="px-4 py-2 text-right font-medium">Versions</th>
              <th className="px-4 py-2 font-medium">Newest</th>
              <th className="px-4 py-2 font-medium">Released</th>
              <th className="px-4 py-2 text-right font-medium">In review</th>
            </tr>
          </thead>
          <tbody>
            {gaits.map((gait) => (
              <tr key={gait.id} className="border-b border-line last:border-0">
                <td className="px-4 py-2">
                  <Link to={`/gaits/${gait.id}`} className="font-medium text-accent underline underline-offset-2">
                    {gait.name}
                  </Link>
                  {gait.description ? <span className="block text-xs text-ink-muted">{gait.description}</span> : null}
                </td>
                <td className="px-4 py-2">
                  <Link to={`/gaits?robot=${gait.robotId}`} className="hover:underline">
                    {gait.robotName}
                  </Link>
                </td>
                <td className="px-4 py-2 text-right tabular-nums">{gait.versionCount}</td>
                <td className="px-4 py-2 whitespace-nowrap">
                  {gait.latestVersion ? (
                    <span className="inline-flex items-center gap-2">
                      <Link
                        to={`/gaits/${gait.id}/versions/${gait.latestVersion}`}
                        className="font-mono text-accent underline underline-offset-2"
                        aria-label={`${gait.name} newest version ${gait.latestVersion}`}
                      >
                        v{gait.latestVersion}
                      </Link>
                      {gait.latestState ? <StateBadge state={gait.latestState} /> : null}
                    </span>
                  ) : (
                    "—"
                  )}
                </td>
                <td className="px-4 py-2 whitespace-nowrap">
                  {gait.releasedVersion ? (
                    <Link
                      to={`/gaits/${gait.id}/versions/${gait.releasedVersion}`}
                      className="font-mono text-accent underline underline-offset-2"
                      aria-label={`${gait.name} released version ${gait.releasedVersion}`}
                    >
                      v{gait.releasedVersion}
                    </Link>
                  ) : (
                    <span className="text-ink-muted">none</span>
                  )}
                </td>
                <td className="px-4 py-2 text-right tabular-nums">{gait.inReview || "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
