// /account/sessions: where the signed-in person is signed in, with a way to end
// any one of those sessions or all of them at once. Each person's own, in a
// workspace or not.
import { Form, redirect } from "react-router";
import { z } from "zod";
import type { Route } from "./+types/sessions";
import { Notice } from "~/components/common/Notice";
import { RowAction } from "~/components/common/RowAction";
import { PageHeader } from "~/components/common/PageHeader";
import { endAllSessions, endSession, listSessions } from "~/features/accounts/sessions.server";
import { requireUser } from "~/platform/access.server";
import { readForm } from "~/platform/body.server";
import { formAction, ServiceError } from "~/platform/errors.server";
import { formatTime } from "~/platform/format";
import type { RoutePermissions } from "~/platform/permissions";
import { destroySession, readSession, SESSION_DAYS } from "~/platform/session.server";

export const permissions = { loader: "signed-in", action: { end: "signed-in", "end-all": "signed-in" } } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const session = await readSession(request);
  return { sessions: await listSessions(user.id, session.id), lifetimeDays: SESSION_DAYS };
}

export const actionForm = z.discriminatedUnion("intent", [
  z.object({ intent: z.literal("end"), sessionId: z.string().regex(/^[0-9a-f]{64}$/, "That is not one of your sessions.") }),
  z.object({ intent: z.literal("end-all") }),
]);

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  return formAction(async () => {
    const parsed = actionForm.safeParse(Object.fromEntries(await readForm(request)));
    if (!parsed.success) throw new ServiceError(400, "bad-request", parsed.error.issues[0]?.message ?? "The form was incomplete; try again.");
    const session = await readSession(request);
    const signedOutHere = async () => redirect("/", { headers: { "Set-Cookie": await destroySession(session) } });
    if (parsed.data.intent === "end-all") {
      await endAllSessions(user);
      return signedOutHere();
    }
    const { current } = await endSession(user, parsed.data.sessionId, session.id);
    if (current) return signedOutHere();
    return { success: "Signed out of that session: its browser must sign in again." };
  });
}

export const meta: Route.MetaFunction = () => [{ title: "Your sessions · Gaitloom" }];

const when = (date: Date | string) => formatTime(date, { zone: false });

export default function Sessions({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <div className="max-w-3xl">
      <PageHeader
        title="Your sessions"
        lead={`Where you are signed in. A session lasts ${loaderData.lifetimeDays} days from sign-in; sign out of any you do not recognise.`}
      />
      <Notice
        error={actionData && "error" in actionData ? actionData.error : null}
        success={actionData && "success" in actionData ? actionData.success : null}
      />
      <table className="w-full border-collapse rounded-lg bg-surface text-left text-sm">
        <caption className="sr-only">Where you are signed in</caption>
        <thead className="border-b border-line text-ink-muted">
          <tr>
            <th className="px-4 py-2 font-medium">Browser</th>
            <th className="px-4 py-2 text-right font-medium">Signed in</th>
            <th className="px-4 py-2 text-right font-medium">Last seen</th>
            <th className="px-4 py-2">
              <span className="sr-only">Sign out</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {loaderData.sessions.map((entry) => (
            <tr key={entry.id} className="border-b border-line last:border-0">
              <td className="px-4 py-2 font-medium">{entry.browser}</td>
              <td className="px-4 py-2 text-right font-mono tabular-nums">{when(entry.createdAt)}</td>
              <td className="px-4 py-2 text-right font-mono tabular-nums">{when(entry.lastSeenAt)}</td>
              <td className="px-4 py-2 text-right">
                {entry.current ? (
                  <span className="rounded-full bg-accent-soft px-2 py-0.5 text-xs font-medium text-accent-strong">This browser</span>
                ) : (
                  <RowAction intent="end" idName="sessionId" id={entry.id} label={`Sign out of ${entry.browser}, last seen ${when(entry.lastSeenAt)}`} danger>
                    Sign out
                  </RowAction>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <Form method="post" className="mt-6 flex items-center justify-between gap-4 rounded-lg border border-line bg-surface p-4">
        <p className="text-ink-muted">Ends every session above, this browser&apos;s too: each must sign in again.</p>
        <input type="hidden" name="intent" value="end-all" />
        <button type="submit" className="shrink-0 rounded-md bg-danger px-4 py-2 font-medium text-on-accent hover:opacity-90">
          Sign out everywhere
        </button>
      </Form>
    </div>
  );
}
