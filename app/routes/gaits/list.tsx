import { Form, Link } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/list";
import { ArchiveControls, ArchiveFilter } from "~/components/archive/ArchiveControls";
import { EmptyState } from "~/components/common/EmptyState";
import { Notice } from "~/components/common/Notice";
import { PageHeader } from "~/components/common/PageHeader";
import { StateBadge } from "~/components/versions/StateBadge";
import { requireAccess } from "~/platform/access.server";
import { listGaits } from "~/features/gaits/gaits.server";
import { can, type RoutePermissions } from "~/platform/permissions";
import { id } from "~/platform/params";
import { listRobots } from "~/features/robots/robots.server";

/** `robot` narrows to one robot's gaits; `show=archived` lists the archived ones; `deleted` names one just deleted, for the notice. */
const listQuery = z.object({
  robot: id().optional().catch(undefined),
  show: z.literal("archived").optional().catch(undefined),
  deleted: z.string().max(120).optional().catch(undefined),
});

export const permissions = { loader: "gaits.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace, role } = await requireAccess(request, permissions.loader);
  const search = new URL(request.url).searchParams;
  const { robot, show, deleted } = listQuery.parse({
    robot: search.get("robot") || undefined,
    show: search.get("show") ?? undefined,
    deleted: search.get("deleted") ?? undefined,
  });
  const archived = show === "archived";
  // Archived robots too: their gaits are still listed, and the filter may name one.
  const robots = await listRobots(workspace.id, { archived: "any" });
  const chosen = robot ? (robots.find((candidate) => candidate.id === robot) ?? null) : null;
  return {
    gaits: await listGaits(workspace.id, { robotId: chosen?.id, archived }),
    robots: robots.map(({ id, name, archivedAt }) => ({ id, name, archived: archivedAt !== null })),
    robot: chosen ? { id: chosen.id, name: chosen.name } : null,
    unknownRobot: Boolean(robot && !chosen),
    archived,
    deleted: deleted ?? null,
    canCreate: can(role, "gaits.edit"),
    canDelete: can(role, "gaits.delete"),
  };
}

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData?.robot ? `Gaits of ${loaderData.robot.name} · Gaitloom` : "Gaits · Gaitloom" },
];

export default function GaitList({ loaderData }: Route.ComponentProps) {
  const { gaits, robots, robot, unknownRobot, archived, deleted, canCreate, canDelete } = loaderData;
  const withRobot = (path: string, more = "") => `${path}${robot ? `?robot=${robot.id}${more ? `&${more}` : ""}` : more ? `?${more}` : ""}`;
  return (
    <>
      <PageHeader title={robot ? `Gaits of ${robot.name}` : "Gaits"} lead="Walks, turns and body moves, each with its newest and its released version.">
        <Form method="get" className="flex items-end gap-2" key={robot?.id ?? "all"}>
          {archived ? <input type="hidden" name="show" value="archived" /> : null}
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
                  {candidate.archived ? `${candidate.name} (archived)` : candidate.name}
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
      <ArchiveFilter archived={archived} label="Which gaits" hrefs={{ inUse: withRobot("/gaits"), archived: withRobot("/gaits", "show=archived") }} />
      <Notice success={deleted ? `${deleted} is deleted, with its draft and versions.` : null} />
      {gaits.length === 0 ? (
        archived ? (
          <EmptyState title={robot ? `No archived gaits of ${robot.name}` : "No archived gaits"}>
            A gait archived from its page is kept here, out of the usual lists, until it is restored or deleted.
          </EmptyState>
        ) : (
          <EmptyState title={robot ? `No gaits for ${robot.name} yet` : "No gaits yet"}>
            Pick a robot and start a gait from a template such as tripod or wave.
          </EmptyState>
        )
      ) : (
        <table
          className="w-full border-collapse rounded-lg bg-surface text-left"
          aria-label={`${archived ? "Archived gaits" : "Gaits"}${robot ? ` of ${robot.name}` : ""}`}
        >
          <thead className="border-b border-line text-sm text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-medium">Gait</th>
              <th className="px-4 py-2 font-medium">Robot</th>
              <th className="px-4 py-2 text-right font-medium">Versions</th>
              <th className="px-4 py-2 font-medium">Newest</th>
              <th className="px-4 py-2 font-medium">Released</th>
              <th className="px-4 py-2 text-right font-medium">In review</th>
              {archived ? (
                <th className="px-4 py-2">
                  <span className="sr-only">Restore or delete</span>
                </th>
              ) : null}
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
                  {gait.robotArchived ? <span className="ml-1 text-xs text-ink-muted">(archived)</span> : null}
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
                {archived ? (
                  <td className="px-4 py-2">
                    <ArchiveControls
                      kind="gait"
                      id={gait.id}
                      name={gait.name}
                      archivedAt={gait.archivedAt}
                      can={{ archive: canCreate, delete: canDelete }}
                      variant="row"
                    />
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
