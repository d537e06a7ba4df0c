import { Link } from "react-router";
import type { Route } from "./+types/home";
import { EmptyState } from "~/components/common/EmptyState";
import { currentWorkspace } from "~/lib/workspace.server";

export async function loader({ request }: Route.LoaderArgs) {
  return { workspace: await currentWorkspace(request) };
}

export const meta: Route.MetaFunction = () => [{ title: "Gaitloom — walking motions you can ship" }];

export default function Home({ loaderData }: Route.ComponentProps) {
  const { workspace } = loaderData;
  return (
    <div className="mx-auto max-w-3xl py-6">
      <h1 className="text-3xl font-semibold tracking-tight">Walking motions you can ship</h1>
      <p className="mt-3 text-lg text-ink-muted">
        Lay out the key poses of a walk on a timeline and Gaitloom checks every frame against each leg's reach, joint
        limits, servo speed and balance. Approved versions become angle tables your firmware plays back.
      </p>
      <div className="mt-8">
        {workspace ? (
          <section className="rounded-lg border border-line bg-surface p-6">
            <h2 className="text-lg font-semibold">Try the demo: {workspace.name}</h2>
            <p className="mt-1 text-ink-muted">
              A harbour-inspection lab with{" "}
              <span className="numeric">{workspace.robotCount}</span> robots and{" "}
              <span className="numeric">{workspace.gaitCount}</span> gaits in progress.
            </p>
            <div className="mt-4 flex gap-3">
              <Link to="/robots" className="rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
                Open the demo robots
              </Link>
              <Link to="/gaits" className="rounded-md border border-line px-4 py-2 font-medium hover:bg-sunken">
                See the gaits
              </Link>
            </div>
          </section>
        ) : (
          <EmptyState title="No workspace yet">
            Run <code className="font-mono">npm start</code> once to load the demo lab, or create a workspace after
            signing in.
          </EmptyState>
        )}
      </div>
    </div>
  );
}
