// POST /sign-out
import { redirect } from "react-router";
import type { Route } from "./+types/sign-out";
import { destroySession, readSession } from "~/platform/session.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { action: "public" } satisfies RoutePermissions;

export async function action({ request }: Route.ActionArgs) {
  const session = await readSession(request);
  return redirect("/", { headers: { "Set-Cookie": await destroySession(session) } });
}
