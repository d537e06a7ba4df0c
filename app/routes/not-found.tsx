// Any address no other route claims: a 404 shown inside the shell.
import { data } from "react-router";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export function loader() {
  throw data({ message: "The address may be mistyped, or what it pointed to was removed." }, { status: 404 });
}

export default function NotFound() {
  return null;
}
