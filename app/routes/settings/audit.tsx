// /settings/audit: the workspace's audit log.
import type { Route } from "./+types/audit";
import { requireAccess } from "~/platform/access.server";
import { formatTime } from "~/platform/format";
import { listAudit } from "~/features/accounts/members.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "audit.read" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  return { entries: await listAudit(member.workspace.id) };
}

export const meta: Route.MetaFunction = () => [{ title: "Audit log · Gaitloom" }];

export default function Audit({ loaderData }: Route.ComponentProps) {
  return (
    <table className="w-full border-collapse rounded-lg bg-surface text-left text-sm">
      <caption className="mb-2 text-left text-ink-muted">The latest {loaderData.entries.length} entries, newest first.</caption>
      <thead className="border-b border-line text-ink-muted">
        <tr>
          <th className="px-4 py-2 font-medium">When (UTC)</th>
          <th className="px-4 py-2 font-medium">Who</th>
          <th className="px-4 py-2 font-medium">What</th>
          <th className="px-4 py-2 font-medium">Details</th>
        </tr>
      </thead>
      <tbody>
        {loaderData.entries.map((entry) => (
          <tr key={entry.id} className="border-b border-line align-top last:border-0">
            <td className="whitespace-nowrap px-4 py-2">{formatTime(entry.at, { seconds: true, zone: false })}</td>
            <td className="px-4 py-2">{entry.actor ?? "—"}</td>
            <td className="px-4 py-2 font-mono">{entry.action}</td>
            <td className="px-4 py-2 font-mono text-xs text-ink-muted">{JSON.stringify(entry.details)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
