// /settings/audit: the workspace's audit log — who did what to which object,
// when — filtered by person, object and action or searched, 50 entries a page,
// newest first, with each entry's recorded details one click away.
import { Form, Link, useSearchParams } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/audit";
import { requireAccess } from "~/platform/access.server";
import { auditChoices, readAuditLog, type AuditCursor, type AuditFilter } from "~/platform/audit-log.server";
import { AUDIT_KINDS, type AuditKind, type AuditPart } from "~/platform/audit-labels";
import { formatTime } from "~/platform/format";
import { id } from "~/platform/params";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "audit.read" } satisfies RoutePermissions;

const kind = z.enum(Object.keys(AUDIT_KINDS) as [AuditKind, ...AuditKind[]]);
const cursor = z
  .string()
  .regex(/^[1-9][0-9]{0,15}$/)
  .transform(Number);

/** The query string: what a person picked in the filter, each part dropped when it does not read. */
const auditQuery = z.object({
  who: z
    .union([z.literal("system"), id()])
    .optional()
    .catch(undefined),
  object: z
    .string()
    .transform((value, context) => {
      const [kindText, objectId] = value.split(":");
      const parsedKind = kind.safeParse(kindText);
      if (!parsedKind.success || (objectId !== undefined && !id().safeParse(objectId).success)) {
        context.addIssue({ code: "custom", message: "not an object" });
        return z.NEVER;
      }
      return { kind: parsedKind.data, id: objectId };
    })
    .optional()
    .catch(undefined),
  action: z
    .string()
    .regex(/^[a-z.-]{1,60}$/)
    .optional()
    .catch(undefined),
  q: z
    .string()
    .trim()
    .max(100)
    .transform((value) => value || undefined)
    .optional()
    .catch(undefined),
  before: cursor.optional().catch(undefined),
  after: cursor.optional().catch(undefined),
});

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireAccess(request, permissions.loader);
  const params = new URL(request.url).searchParams;
  const query = auditQuery.parse(Object.fromEntries([...params].filter(([, value]) => value !== "")));
  const filter: AuditFilter = { actor: query.who, object: query.object, action: query.action, q: query.q };
  const at: AuditCursor = query.after !== undefined ? { after: query.after } : query.before !== undefined ? { before: query.before } : {};
  const [page, choices] = await Promise.all([readAuditLog(member.workspace.id, filter, at), auditChoices(member.workspace.id)]);
  return {
    page: {
      ...page,
      entries: page.entries.map((entry) => ({ ...entry, details: JSON.stringify(entry.details, null, 2) })),
    },
    choices,
    filtered: Boolean(query.who || query.object || query.action || query.q),
  };
}

export const meta: Route.MetaFunction = () => [{ title: "Audit log · Gaitloom" }];

function Sentence({ parts }: { parts: AuditPart[] }) {
  return (
    <>
      {parts.map((part, index) =>
        typeof part === "string" ? (
          <span key={index}>{part}</span>
        ) : part.href ? (
          <Link key={index} to={part.href} className="font-medium text-accent underline underline-offset-2">
            {part.name}
          </Link>
        ) : (
          <strong key={index} className="font-medium">
            {part.name}
          </strong>
        ),
      )}
    </>
  );
}

const selectClass = "w-full rounded-md border border-line bg-canvas px-2 py-1.5 text-sm text-ink";

export default function Audit({ loaderData }: Route.ComponentProps) {
  const { page, choices, filtered } = loaderData;
  const [searchParams] = useSearchParams();
  const pageLink = (cursor: { before?: number; after?: number }) => {
    const next = new URLSearchParams(searchParams);
    next.delete("before");
    next.delete("after");
    if (cursor.before !== undefined) next.set("before", String(cursor.before));
    if (cursor.after !== undefined) next.set("after", String(cursor.after));
    const text = next.toString();
    return text ? `?${text}` : ".";
  };
  const first = page.newerCount + 1;
  const last = page.newerCount + page.entries.length;
  return (
    <div className="space-y-4">
      {/* Keyed by the filter in the address, so the fields show it after every navigation (Clear, a link, back). */}
      <Form
        key={["who", "object", "action", "q"].map((name) => searchParams.get(name) ?? "").join("|")}
        method="get"
        role="search"
        aria-label="Filter the audit log"
        className="grid gap-3 rounded-lg border border-line bg-surface p-4 sm:grid-cols-2 lg:grid-cols-5"
      >
        <label className="flex flex-col gap-1 text-sm font-medium">
          Person
          <select name="who" defaultValue={searchParams.get("who") ?? ""} className={selectClass}>
            <option value="">Anyone</option>
            {choices.people.map((person) => (
              <option key={person.id} value={person.id}>
                {person.name}
              </option>
            ))}
            <option value="system">Gaitloom itself</option>
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm font-medium">
          Object
          <select name="object" defaultValue={searchParams.get("object") ?? ""} className={selectClass}>
            <option value="">Anything</option>
            {choices.objects.map((group) => (
              <optgroup key={group.kind} label={group.label}>
                <option value={group.kind}>Any of: {group.label.toLowerCase()}</option>
                {group.items.map((item) => (
                  <option key={item.id} value={`${group.kind}:${item.id}`}>
                    {item.name}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm font-medium">
          Action
          <select name="action" defaultValue={searchParams.get("action") ?? ""} className={selectClass}>
            <option value="">Any action</option>
            {choices.actions.map((group) => (
              <optgroup key={group.kind} label={group.label}>
                {group.items.map((item) => (
                  <option key={item.action} value={item.action}>
                    {item.label}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm font-medium">
          Search
          <input
            type="search"
            name="q"
            defaultValue={searchParams.get("q") ?? ""}
            maxLength={100}
            placeholder="a name, an address, a word"
            className="rounded-md border border-line bg-canvas px-2 py-1.5 text-sm text-ink"
          />
        </label>
        <div className="flex items-end gap-2">
          <button type="submit" className="rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-on-accent hover:bg-accent-strong">
            Show
          </button>
          {filtered ? (
            <Link to="/settings/audit" className="rounded-md border border-line px-3 py-1.5 text-sm font-medium hover:bg-sunken">
              Clear
            </Link>
          ) : null}
        </div>
      </Form>

      <nav aria-label="Audit log pages" className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <p className="text-ink-muted" aria-live="polite">
          {page.total === 0
            ? filtered
              ? "No entry matches this filter."
              : "Nothing has been recorded yet."
            : page.total === 1
              ? `1 entry${filtered ? " matches" : ""}.`
              : `Entries ${first}–${last} of ${page.total}${filtered ? " that match" : ""}, newest first.`}
        </p>
        <PageLinks newer={page.newer} older={page.older} atNewest={page.newerCount === 0} pageLink={pageLink} />
      </nav>

      {page.entries.length > 0 ? (
        <table className="w-full table-fixed border-collapse rounded-lg bg-surface text-left text-sm">
          <caption className="sr-only">
            Audit log entries {first} to {last}, newest first
          </caption>
          <colgroup>
            <col className="w-48" />
            <col />
          </colgroup>
          <thead className="border-b border-line text-ink-muted">
            <tr>
              <th className="px-4 py-2 font-medium">When (UTC)</th>
              <th className="px-4 py-2 font-medium">What</th>
            </tr>
          </thead>
          <tbody>
            {page.entries.map((entry) => (
              <tr key={entry.id} className="border-b border-line align-top last:border-0">
                <td className="px-4 py-2 font-mono text-xs whitespace-nowrap tabular-nums">{formatTime(entry.at, { seconds: true, zone: false })}</td>
                <td className="px-4 py-2 break-words">
                  <Sentence parts={entry.sentence} />
                  <details className="mt-1">
                    <summary className="w-fit cursor-pointer text-xs text-ink-muted underline-offset-2 hover:underline">
                      Recorded details<span className="sr-only"> of entry {entry.id}</span>
                    </summary>
                    <p className="mt-1 font-mono text-xs text-ink-muted">
                      #{entry.id} · {entry.action}
                      {entry.target.type ? ` · ${entry.target.type} ${entry.target.id ?? ""}` : ""}
                    </p>
                    <pre className="mt-1 max-h-64 overflow-auto rounded-md border border-line bg-canvas p-2 font-mono text-xs break-all whitespace-pre-wrap">
                      {entry.details}
                    </pre>
                  </details>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}

      {page.entries.length > 0 ? (
        <nav aria-label="Audit log pages, again" className="flex justify-end text-sm">
          <PageLinks newer={page.newer} older={page.older} atNewest={page.newerCount === 0} pageLink={pageLink} />
        </nav>
      ) : null}
    </div>
  );
}

function PageLinks({
  newer,
  older,
  atNewest,
  pageLink,
}: {
  newer: number | null;
  older: number | null;
  atNewest: boolean;
  pageLink: (cursor: { before?: number; after?: number }) => string;
}) {
  const link = "rounded-md border border-line bg-surface px-3 py-1 font-medium hover:bg-sunken";
  const off = "rounded-md border border-line px-3 py-1 text-ink-muted";
  return (
    <div className="flex gap-2">
      {atNewest ? (
        <span className={off} aria-disabled="true">
          Newest
        </span>
      ) : (
        <Link to={pageLink({})} className={link}>
          Newest
        </Link>
      )}
      {newer !== null ? (
        <Link to={pageLink({ after: newer })} className={link} rel="prev">
          ← Newer
        </Link>
      ) : (
        <span className={off} aria-disabled="true">
          ← Newer
        </span>
      )}
      {older !== null ? (
        <Link to={pageLink({ before: older })} className={link} rel="next">
          Older →
        </Link>
      ) : (
        <span className={off} aria-disabled="true">
          Older →
        </span>
      )}
    </div>
  );
}
