import { Form, Link, NavLink, useLocation } from "react-router";
import type { Role } from "~/platform/permissions";
import { type Action, ROLE_LABELS, can } from "~/platform/permissions";
import { Mark } from "./Mark";
import { NavigationProgress } from "./NavigationProgress";
import { ThemeToggle } from "./ThemeToggle";

export type ShellData = {
  user: { name: string; login: string } | null;
  role: Role | null;
  workspace: { id: string; slug: string; name: string; robotCount: number; gaitCount: number } | null;
  workspaces: { id: string; name: string; role: Role }[];
  localMail: boolean;
};

const sections: { to: string; label: string; hint: string; needs?: Action }[] = [
  { to: "/robots", label: "Robots", hint: "Legs, joints and servos" },
  { to: "/gaits", label: "Gaits", hint: "Walks, turns and moves" },
  { to: "/reviews", label: "Reviews", hint: "Versions waiting for you" },
  { to: "/export", label: "Export", hint: "Angle tables for firmware", needs: "tables.download" },
  { to: "/settings", label: "Settings", hint: "Workspace and members" },
];

export function AppShell({ data, children }: { data: ShellData | null; children: React.ReactNode }) {
  return (
    <div className="grid min-h-screen grid-cols-[13rem_1fr] grid-rows-[3.25rem_1fr]">
      <header className="col-span-2 flex items-center gap-4 border-b border-line bg-surface px-4">
        <Link to="/" className="flex items-center gap-2 font-semibold tracking-tight">
          <Mark />
          <span className="text-lg">Gaitloom</span>
        </Link>
        {data?.user ? <WorkspaceSwitcher data={data} /> : null}
        <div className="ml-auto flex items-center gap-3">
          <NavigationProgress />
          {data?.localMail ? (
            <Link to="/local/mail" className="text-sm text-ink-muted hover:text-ink">
              Local inbox
            </Link>
          ) : null}
          <ThemeToggle />
          <UserMenu data={data} />
        </div>
      </header>
      <nav aria-label="Sections" className="border-r border-line bg-surface px-3 py-4">
        <ul className="space-y-1">
          {sections
            .filter((section) => !section.needs || !data?.role || can(data.role, section.needs))
            .map((section) => (
              <li key={section.to}>
                <NavLink
                  to={section.to}
                  className={({ isActive }) => `block rounded-md px-3 py-2 ${isActive ? "bg-accent-soft text-accent-strong" : "hover:bg-sunken"}`}
                >
                  <span className="block font-medium">{section.label}</span>
                  <span className="block text-xs text-ink-muted">{section.hint}</span>
                </NavLink>
              </li>
            ))}
        </ul>
        <p className="mt-6 px-3 text-xs text-ink-muted">
          <Link to="/api-docs" className="hover:text-ink">
            API reference
          </Link>
        </p>
      </nav>
      <main id="content" className="min-w-0 px-8 py-6">
        {children}
      </main>
    </div>
  );
}

function WorkspaceSwitcher({ data }: { data: ShellData }) {
  const location = useLocation();
  if (!data.workspace) {
    return (
      <Link to="/welcome" className="rounded-md border border-line px-3 py-1 text-sm hover:bg-sunken">
        Choose a workspace
      </Link>
    );
  }
  if (data.workspaces.length < 2) {
    return (
      <span className="rounded-md border border-line px-3 py-1 text-sm">
        <span className="text-ink-muted">Workspace </span>
        <span className="font-medium">{data.workspace.name}</span>
      </span>
    );
  }
  return (
    <Form method="post" action="/workspace" className="flex items-center gap-2 text-sm">
      <input type="hidden" name="returnTo" value={location.pathname} />
      <label htmlFor="workspace-switch" className="text-ink-muted">
        Workspace
      </label>
      <select
        id="workspace-switch"
        name="workspaceId"
        defaultValue={data.workspace.id}
        className="rounded-md border border-line bg-surface px-2 py-1"
        onChange={(event) => event.currentTarget.form?.requestSubmit()}
      >
        {data.workspaces.map((workspace) => (
          <option key={workspace.id} value={workspace.id}>
            {workspace.name} ({ROLE_LABELS[workspace.role].toLowerCase()})
          </option>
        ))}
      </select>
      <noscript>
        <button type="submit">Switch</button>
      </noscript>
    </Form>
  );
}

/**
 * Where the header's "Sign in" brings the person back to: this page with its
 * query, or, on the sign-in page itself, the page it was already taking them
 * to (an invitation link, say), never the sign-in page.
 */
export function signInReturnTo(location: { pathname: string; search: string }): string {
  if (location.pathname === "/sign-in") return new URLSearchParams(location.search).get("returnTo") ?? "/";
  return `${location.pathname}${location.search}`;
}

function UserMenu({ data }: { data: ShellData | null }) {
  const location = useLocation();
  // No shell data (an error page whose loaders did not run): who is signed in is unknown, so neither "Sign in" nor a menu.
  if (!data) return null;
  if (!data.user) {
    return (
      <Link
        to={`/sign-in?returnTo=${encodeURIComponent(signInReturnTo(location))}`}
        className="rounded-md bg-accent px-3 py-1 text-sm font-medium text-on-accent hover:bg-accent-strong"
      >
        Sign in
      </Link>
    );
  }
  return (
    <details className="relative">
      <summary
        className="cursor-pointer list-none rounded-md px-2 py-1 text-sm hover:bg-sunken"
        // The name starts with the visible text, as speech-input users say what they see.
        aria-label={`${data.user.name}${data.role ? ` ${ROLE_LABELS[data.role]}` : ""}, your account`}
      >
        <span className="font-medium">{data.user.name}</span>
        {data.role ? <span className="ml-2 text-ink-muted">{ROLE_LABELS[data.role]}</span> : null}
      </summary>
      <div className="absolute right-0 z-20 mt-1 w-56 rounded-md border border-line bg-surface p-2 shadow-lg">
        <p className="px-2 py-1 text-xs text-ink-muted">Signed in as @{data.user.login}</p>
        {/* Only the roles that may hold a token: the others would reach a refusal. */}
        {can(data.role, "tokens.manage") ? (
          <Link to="/settings/tokens" className="block rounded px-2 py-1 text-sm hover:bg-sunken">
            API tokens
          </Link>
        ) : null}
        <Link to="/account/sessions" className="block rounded px-2 py-1 text-sm hover:bg-sunken">
          Your sessions
        </Link>
        <Form method="post" action="/sign-out">
          <button type="submit" className="block w-full rounded px-2 py-1 text-left text-sm hover:bg-sunken">
            Sign out
          </button>
        </Form>
      </div>
    </details>
  );
}
