import { Form, redirect } from "react-router";
import type { Route } from "./+types/sign-in";
import { currentUser } from "~/platform/access.server";
import { safeReturnTo } from "~/platform/session.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  const returnTo = safeReturnTo(new URL(request.url).searchParams.get("returnTo"));
  if (await currentUser(request)) throw redirect(returnTo);
  return { returnTo };
}

export const meta: Route.MetaFunction = () => [{ title: "Sign in · Gaitloom" }];

export default function SignIn({ loaderData }: Route.ComponentProps) {
  return (
    <div className="mx-auto max-w-md py-12">
      <h1 className="text-2xl font-semibold tracking-tight">Sign in to Gaitloom</h1>
      <p className="mt-2 text-ink-muted">Your GitHub account is your Gaitloom sign-in; your workspace decides what you can do.</p>
      <Form method="post" action="/auth/github" className="mt-6">
        <input type="hidden" name="returnTo" value={loaderData.returnTo} />
        <button type="submit" className="w-full rounded-md bg-accent px-4 py-2 font-medium text-on-accent hover:bg-accent-strong">
          Sign in with GitHub
        </button>
      </Form>
    </div>
  );
}
