import type { Route } from "./+types/settings";
import { EmptyState } from "~/components/common/EmptyState";
import { PageHeader } from "~/components/common/PageHeader";
import { currentWorkspace } from "~/lib/workspace.server";

export async function loader({ request }: Route.LoaderArgs) {
  return { workspace: await currentWorkspace(request) };
}

export const meta: Route.MetaFunction = () => [{ title: "Settings · Gaitloom" }];

export default function Settings({ loaderData }: Route.ComponentProps) {
  const { workspace } = loaderData;
  return (
    <>
      <PageHeader title="Settings" lead="The workspace, its members and their roles, and API tokens." />
      {workspace ? (
        <dl className="grid max-w-lg grid-cols-[10rem_1fr] gap-y-2 rounded-lg bg-surface p-6">
          <dt className="text-ink-muted">Workspace</dt>
          <dd className="font-medium">{workspace.name}</dd>
          <dt className="text-ink-muted">Address name</dt>
          <dd className="font-mono">{workspace.slug}</dd>
        </dl>
      ) : (
        <EmptyState title="No workspace yet">Create a workspace to invite your team.</EmptyState>
      )}
    </>
  );
}
