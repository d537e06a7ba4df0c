import { Link, NavLink } from "react-router";
import type { WorkspaceSummary } from "~/lib/workspace.server";
import { Mark } from "./Mark";
import { ThemeToggle } from "./ThemeToggle";

const sections = [
  { to: "/robots", label: "Robots", hint: "Legs, joints and servos" },
  { to: "/gaits", label: "Gaits", hint: "Walks, turns and moves" },
  { to: "/reviews", label: "Reviews", hint: "Versions waiting for you" },
  { to: "/settings", label: "Settings", hint: "Workspace and members" },
] as const;

export function AppShell({ workspace, children }: { workspace: WorkspaceSummary | null; children: React.ReactNode }) {
  return (
    <div className="grid min-h-screen grid-cols-[13rem_1fr] grid-rows-[3.25rem_1fr]">
      <header className="col-span-2 flex items-center gap-4 border-b border-line bg-surface px-4">
        <Link to="/" className="flex items-center gap-2 font-semibold tracking-tight">
          <Mark />
          <span className="text-lg">Gaitloom</span>
        </Link>
        <WorkspaceSwitcher workspace={workspace} />
        <div className="ml-auto flex items-center gap-2">
          <ThemeToggle />
          <UserMenu />
        </div>
      </header>
      <nav aria-label="Sections" className="border-r border-line bg-surface px-3 py-4">
        <ul className="space-y-1">
          {sections.map((section) => (
            <li key={section.to}>
              <NavLink
                to={section.to}
                className={({ isActive }) =>
                  `block rounded-md px-3 py-2 ${isActive ? "bg-accent-soft text-accent-strong" : "hover:bg-sunken"}`
                }
              >
                <span className="block font-medium">{section.label}</span>
                <span className="block text-xs text-ink-muted">{section.hint}</span>
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
      <main id="content" className="min-w-0 px-8 py-6">
        {children}
      </main>
    </div>
  );
}

function WorkspaceSwitcher({ workspace }: { workspace: WorkspaceSummary | null }) {
  return (
    <button
      type="button"
      className="flex items-center gap-2 rounded-md border border-line px-3 py-1 text-sm hover:bg-sunken"
      aria-label={workspace ? `Workspace: ${workspace.name}` : "No workspace"}
      title="Switching workspaces comes with sign-in"
    >
      <span className="text-ink-muted">Workspace</span>
      <span className="font-medium">{workspace?.name ?? "none yet"}</span>
    </button>
  );
}

function UserMenu() {
  return (
    <span className="rounded-md bg-sunken px-3 py-1 text-sm text-ink-muted" aria-label="Signed-in person">
      Guest
    </span>
  );
}
