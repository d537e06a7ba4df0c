// The frame around every page: top bar, navigation, and errors shown inside it.
import { Outlet, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/shell";
import { RouteErrorBoundary } from "~/components/common/ErrorPanel";
import { AppShell, type ShellData } from "~/components/shell/AppShell";
import { currentMember, currentUser, membershipsOf } from "~/platform/access.server";
import { config } from "~/platform/config.server";
import { summarizeWorkspace } from "~/features/accounts/workspaces.server";
import { can, type RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs): Promise<ShellData> {
  const [user, member] = await Promise.all([currentUser(request), currentMember(request)]);
  const workspaces = user ? await membershipsOf(user.id) : [];
  return {
    user: user ? { name: user.name, login: user.login } : null,
    role: member?.role ?? null,
    workspace: member ? await summarizeWorkspace(member.workspace) : null,
    workspaces: workspaces.map(({ workspace, role }) => ({ id: workspace.id, name: workspace.name, role })),
    localMail: config().local && can(member?.role, "mail.readLocal"),
  };
}

export default function Shell({ loaderData }: Route.ComponentProps) {
  return (
    <AppShell data={loaderData}>
      <Outlet />
    </AppShell>
  );
}

export function ErrorBoundary() {
  // A child page failed: the shell's own data is usually still there.
  const data = useRouteLoaderData<typeof loader>("routes/shell");
  return (
    <AppShell data={data ?? null}>
      <RouteErrorBoundary />
    </AppShell>
  );
}
