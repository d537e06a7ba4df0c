// The frame around every page: top bar, navigation, and errors shown inside it.
import { Outlet, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/shell";
import { ErrorPanel } from "~/components/common/ErrorPanel";
import { AppShell } from "~/components/shell/AppShell";
import { currentWorkspace } from "~/lib/workspace.server";

export async function loader({ request }: Route.LoaderArgs) {
  return { workspace: await currentWorkspace(request) };
}

export default function Shell({ loaderData }: Route.ComponentProps) {
  return (
    <AppShell workspace={loaderData.workspace}>
      <Outlet />
    </AppShell>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  // A child page failed: the shell's own data is usually still there.
  const data = useRouteLoaderData<typeof loader>("routes/shell");
  return (
    <AppShell workspace={data?.workspace ?? null}>
      <div className="mx-auto max-w-2xl py-10">
        <ErrorPanel error={error} />
      </div>
    </AppShell>
  );
}
