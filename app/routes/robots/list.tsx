import { Link, redirect, useSearchParams } from "react-router";
import type { Route } from "./+types/list";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
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

export async function loader({ request }: Route.LoaderArgs) {
  const { workspace, role } = await requireAccess(request, permissions.loader);
  return { robots: await listRobots(workspace.id), canEdit: can(role, "robots.edit") };
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
  const { robots, canEdit } = loaderData;
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
