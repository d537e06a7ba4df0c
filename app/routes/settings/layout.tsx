// /settings/*: the workspace's settings with one tab per part a role may see.
import { NavLink, Outlet } from "react-router";
import type { Route } from "./+types/layout";
import { PageHeader } from "~/components/common/PageHeader";
import { requireAccess } from "~/platform/access.server";
import { can, type RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "workspace.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const { role } = await requireAccess(request, permissions.loader);
  return { tokens: can(role, "tokens.manage"), audit: can(role, "audit.read") };
}

export default function SettingsLayout({ loaderData }: Route.ComponentProps) {
  const tabs = [
    { to: "/settings", label: "Workspace", end: true },
    { to: "/settings/members", label: "Members", end: false },
    ...(loaderData.tokens ? [{ to: "/settings/tokens", label: "API tokens", end: false }] : []),
    ...(loaderData.audit ? [{ to: "/settings/audit", label: "Audit log", end: false }] : []),
  ];
  return (
    <>
      <PageHeader title="Settings" lead={`The workspace, its members and their roles${loaderData.tokens ? ", and API tokens" : ""}.`} />
      <nav aria-label="Settings" className="mb-6 flex gap-1 border-b border-line">
        {tabs.map((tab) => (
          <NavLink
            key={tab.to}
            to={tab.to}
            end={tab.end}
            className={({ isActive }) =>
              `-mb-px border-b-2 px-3 py-2 text-sm font-medium ${isActive ? "border-accent text-accent-strong" : "border-transparent text-ink-muted hover:text-ink"}`
            }
          >
            {tab.label}
          </NavLink>
        ))}
      </nav>
      <Outlet />
    </>
  );
}
