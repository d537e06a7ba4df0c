import { Link, redirect, useSearchParams } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/list";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
import { ArchiveControls, ArchiveFilter } from "~/components/archive/ArchiveControls";
import { Notice } from "~/components/common/Notice";
import { AddRobotPanel, type AddPanel } from "~/components/robots/AddRobotPanels";
import { requireAccess } from "~/platform/access.server";
import { permissionOfEveryIntent } from "~/platform/intent-form.server";
import { formatDate } from "~/platform/format";
import { can, type RoutePermissions } from "~/platform/permissions";
import { addRobot, ADD_BODY_LIMIT_BYTES } from "~/features/robots/add.server";
import { readFormWithin } from "~/platform/body.server";
import { formAction } from "~/platform/errors.server";
import type { AddRefusalDetails, ImportedRobot } from "~/features/robots/results";
import { listRobots } from "~/features/robots/robots.server";

export { addForm as actionForm } from "~/features/robots/params";

export const permissions = {
  loader: "robots.read",
  action: { create: "robots.edit", upload: "robots.edit", "import-urdf": "robots.edit" },
} satisfies RoutePermissions;

/** `show=archived` lists the archived robots; `deleted` names one just deleted, for the notice. */
const listQuery = z.object({
  show: z.literal("archived").optional().catch(undefined),
  deleted: z.string().max(120).optional().catch(undefined),
});

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace, role } = await requireAccess(request, permissions.loader);
  const search = new URL(request.url).searchParams;
  const query = listQuery.parse({ show: search.get("show") ?? undefined, deleted: search.get("deleted") ?? undefined });
  const archived = query.show === "archived";
  return {
    robots: await listRobots(workspace.id, { archived }),
    archived,
    deleted: query.deleted ?? null,
    canEdit: can(role, "robots.edit"),
    canDelete: can(role, "robots.delete"),
  };
}

export async function action({ request }: Route.ActionArgs) {
  const member = await requireAccess(request, permissionOfEveryIntent(permissions.action));
  return formAction<ImportedRobot | Response, AddRefusalDetails>(async () => {
    const added = await addRobot(await readFormWithin(request, ADD_BODY_LIMIT_BYTES), member);
    return "redirectTo" in added ? redirect(added.redirectTo) : added;
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Robots · Gaitloom" }];

const PANELS: { panel: AddPanel; label: string }[] = [
  { panel: "new", label: "New robot" },
  { panel: "upload", label: "Upload definition" },
  { panel: "urdf", label: "Import URDF" },
];

const panelOf = (value: string | null): AddPanel | null => (value === "new" || value === "upload" || value === "urdf" ? value : null);

export default function RobotList({ loaderData, actionData }: Route.ComponentProps) {
  const { robots, archived, deleted, canEdit, canDelete } = loaderData;
  const [searchParams] = useSearchParams();
  const open = panelOf(searchParams.get("add"));
  return (
    <>
      <PageHeader title="Robots" lead="Each robot's legs, joint limits and servo wiring. Every save is kept as a revision.">
        {canEdit
          ? PANELS.map(({ panel, label }) => (
              <Link
                key={panel}
                to={open === panel ? "." : `?add=${panel}`}
                aria-current={open === panel ? "true" : undefined}
                className={`rounded-md border px-3 py-1.5 text-sm font-medium ${
                  open === panel ? "border-accent bg-accent-soft text-accent-strong" : "border-line bg-surface hover:bg-sunken"
                }`}
              >
                {label}
              </Link>
            ))
          : null}
      </PageHeader>
      {canEdit && open ? <AddRobotPanel panel={open} robots={robots} result={actionData ?? null} /> : null}
      <ArchiveFilter archived={archived} label="Which robots" hrefs={{ inUse: "/robots", archived: "/robots?show=archived" }} />
      <Notice success={deleted ? `${deleted} is deleted, with its revisions and calibration profiles.` : null} />
      {robots.length === 0 ? (
        archived ? (
          <EmptyState title="No archived robots">
            A robot archived from its page is kept here, out of the usual lists, until it is restored or deleted.
          </EmptyState>
        ) : (
          <EmptyState title="No robots yet">Add a robot by uploading its definition or importing a URDF file.</EmptyState>
        )
      ) : archived ? (
        <table className="w-full border-collapse rounded-lg bg-surface text-left" aria-label="Archived robots">
          <thead className="border-b border-line text-sm text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-medium">Name</th>
              <th className="px-4 py-2 text-right font-medium">Legs</th>
              <th className="px-4 py-2 text-right font-medium">Revision</th>
              <th className="px-4 py-2 text-right font-medium">Archived</th>
              <th className="px-4 py-2">
                <span className="sr-only">Restore or delete</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {robots.map((robot) => (
              <tr key={robot.id} className="border-b border-line align-top last:border-0">
                <td className="px-4 py-2 font-medium">
                  <Link to={`/robots/${robot.id}`} className="text-accent underline-offset-4 hover:underline">
                    {robot.name}
                  </Link>
                </td>
                <td className="px-4 py-2 text-right tabular-nums">{robot.legCount}</td>
                <td className="px-4 py-2 text-right tabular-nums">{robot.latestRevision}</td>
                <td className="px-4 py-2 text-right tabular-nums">{robot.archivedAt ? formatDate(robot.archivedAt) : "—"}</td>
                <td className="px-4 py-2">
                  <ArchiveControls
                    kind="robot"
                    id={robot.id}
                    name={robot.name}
                    archivedAt={robot.archivedAt}
                    can={{ archive: canEdit, delete: canDelete }}
                    variant="row"
                  />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
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
                <td className="px-4 py-2 font-medium">
                  <Link to={`/robots/${robot.id}`} className="text-accent underline-offset-4 hover:underline">
                    {robot.name}
                  </Link>
                </td>
                <td className="px-4 py-2 text-right">{robot.legCount}</td>
                <td className="px-4 py-2 text-right">{robot.latestRevision}</td>
                <td className="px-4 py-2 text-right">{formatDate(robot.updatedAt)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
