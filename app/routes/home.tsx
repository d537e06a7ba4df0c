import { Link } from "react-router";
import { Notice } from "~/components/common/Notice";
import type { Route } from "./+types/home";
import { currentMember, currentUser } from "~/platform/access.server";
import { summarizeWorkspace } from "~/features/accounts/workspaces.server";
import { ROLE_LABELS, type RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const [user, member] = await Promise.all([currentUser(request), currentMember(request)]);
  // After accepting an invitation: said for the workspace the person is now in, and only that one.
  const joined =
    member && new URL(request.url).searchParams.get("joined") === member.workspace.id ? { workspaceName: member.workspace.name, role: member.role } : null;
  return { signedIn: Boolean(user), workspace: member ? await summarizeWorkspace(member.workspace) : null, joined };
}

export const meta: Route.MetaFunction = () => [{ title: "Gaitloom — walking motions you can ship" }];

const primary = "rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong";
const secondary = "rounded-md border border-line px-4 py-2 font-medium hover:bg-sunken";

export default function Home({ loaderData }: Route.ComponentProps) {
  const { workspace, signedIn, joined } = loaderData;
  return (
    <div className="mx-auto max-w-3xl py-6">
      <Notice success={joined ? `You joined ${joined.workspaceName} as ${ROLE_LABELS[joined.role].toLowerCase()}.` : null} />
      <h1 className="text-3xl font-semibold tracking-tight">Walking motions you can ship</h1>
      <p className="mt-3 text-lg text-ink-muted">
        Lay out the key poses of a walk on a timeline and Gaitloom checks every frame against each leg's reach, joint limits, servo speed and balance. Approved
        versions become angle tables your firmware plays back.
      </p>
      <section className="mt-8 rounded-lg border border-line bg-surface p-6">
        {workspace ? (
          <>
            <h2 className="text-lg font-semibold">{workspace.name}</h2>
            <p className="mt-1 text-ink-muted">
              <span className="numeric">{workspace.robotCount}</span> robots and <span className="numeric">{workspace.gaitCount}</span> gaits.
            </p>
            <div className="mt-4 flex gap-3">
              <Link to="/robots" className={primary}>
                Open the robots
              </Link>
              <Link to="/gaits" className={secondary}>
                See the gaits
              </Link>
            </div>
          </>
        ) : signedIn ? (
          <>
            <h2 className="text-lg font-semibold">You are not in a workspace yet</h2>
            <p className="mt-1 text-ink-muted">Start one for your team, or accept an invitation sent to your e-mail.</p>
            <Link to="/welcome" className={`mt-4 inline-block ${primary}`}>
              Get started
            </Link>
          </>
        ) : (
          <>
            <h2 className="text-lg font-semibold">Try the demo</h2>
            <p className="mt-1 text-ink-muted">
              Breakwater Robotics Lab inspects harbour walls with a six-legged crawler, a four-legged walker and an eight-legged climber. Sign in as one of its
              people to look around.
            </p>
            <Link to="/sign-in" className={`mt-4 inline-block ${primary}`}>
              Sign in to the demo
            </Link>
          </>
        )}
      </section>
    </div>
  );
}
