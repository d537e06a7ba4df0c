// The route table. What each route needs (a permission, a signed-in person, or
// nothing) is declared once, in its module's `permissions` export; the access
// matrix and the OpenAPI document read it there.
import { type RouteConfig, index, layout, prefix, route } from "@react-router/dev/routes";
import { exportApi } from "./routes/api.v1/export/routes";
import { gaitArchiveApi } from "./routes/api.v1/gaits/archive-routes";
import { editorApi } from "./routes/api.v1/gaits/editor-routes";
import { versionApi } from "./routes/api.v1/gaits/version-routes";
import { robotApi } from "./routes/api.v1/robots/routes";
import { exportPages } from "./routes/export/routes";
import { editorPages } from "./routes/gaits/editor-routes";
import { versionPages } from "./routes/gaits/version-routes";
import { robotPages } from "./routes/robots/routes";

export default [
  route("healthz", "routes/healthz.ts"),
  ...prefix("api/v1", [
    route("workspace", "routes/api.v1/workspace.ts"),
    route("solve", "routes/api.v1/solver/solve.ts"),
    route("ik", "routes/api.v1/solver/ik.ts"),
    ...robotApi,
    ...editorApi,
    ...gaitArchiveApi,
    ...versionApi,
    ...exportApi,
    // Any other address under /api/v1: a JSON 404, not the shell's HTML page.
    route("*", "routes/api.v1/not-found.ts"),
  ]),
  route("auth/github", "routes/auth/github.ts"),
  route("auth/github/callback", "routes/auth/github-callback.ts"),
  route("sign-out", "routes/auth/sign-out.ts"),
  route("workspace", "routes/workspace-switch.ts"),
  layout("routes/shell.tsx", [
    index("routes/home.tsx"),
    route("sign-in", "routes/auth/sign-in.tsx"),
    route("welcome", "routes/welcome.tsx"),
    route("account/sessions", "routes/account/sessions.tsx"),
    route("invitations/:token", "routes/invitations/accept.tsx"),
    ...prefix("robots", robotPages),
    ...prefix("gaits", [index("routes/gaits/list.tsx"), route(":gaitId/archive", "routes/gaits/archive.ts"), ...editorPages, ...versionPages]),
    route("reviews", "routes/reviews.tsx"),
    ...exportPages,
    route("settings", "routes/settings/layout.tsx", [
      index("routes/settings/workspace.tsx"),
      route("members", "routes/settings/members.tsx"),
      route("tokens", "routes/settings/tokens.tsx"),
      route("audit", "routes/settings/audit.tsx"),
    ]),
    route("local/mail", "routes/local/mail.tsx"),
    route("*", "routes/not-found.tsx"),
  ]),
] satisfies RouteConfig;
