import "@fontsource/ibm-plex-sans/400.css";
import "@fontsource/ibm-plex-sans/500.css";
import "@fontsource/ibm-plex-sans/600.css";
import "@fontsource/ibm-plex-mono/400.css";
import "./app.css";

import { Links, Meta, Outlet, Scripts, ScrollRestoration, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/root";
import { ErrorPanel } from "./components/common/ErrorPanel";
import { addressRefusal } from "./platform/address.server";
import { apiErrorShape } from "./platform/api-answers.server";
import { useNonce } from "./platform/nonce";
import { crossOriginRefusal } from "./platform/origin.server";
import { readTheme } from "./platform/theme";
import type { RoutePermissions } from "./platform/permissions";

export const middleware: Route.MiddlewareFunction[] = [
  // First, so that what the others and the routes answer under /api/v1 comes out in the API's error shape.
  ({ request }, next) => apiErrorShape(request, next),
  async ({ request }, next) => {
    const refusal = crossOriginRefusal(request) ?? addressRefusal(request);
    if (refusal) throw refusal;
    return next();
  },
];

export const permissions = { loader: "public" } satisfies RoutePermissions;

export async function loader({ request }: Route.LoaderArgs) {
  return { theme: readTheme(request.headers.get("Cookie")) };
}

export const meta: Route.MetaFunction = () => [
  { title: "Gaitloom" },
  { name: "description", content: "Design, check and ship the walking motions of legged robots." },
];

export const links: Route.LinksFunction = () => [{ rel: "icon", href: "/favicon.svg", type: "image/svg+xml" }];

// zod probes for `new Function` as each schema is made, for its fast parser;
// the page's policy refuses it and reports a violation, though zod catches the
// refusal. `jitless` skips the probe. It is set before any module runs (a
// chunk of schemas can load ahead of every module of ours), in the object
// z.config writes to (zod/v4/core/core.js).
const ZOD_JITLESS = "(globalThis.__zod_globalConfig ??= {}).jitless = true;";

export function Layout({ children }: { children: React.ReactNode }) {
  const data = useRouteLoaderData<typeof loader>("root");
  const nonce = useNonce();
  return (
    <html lang="en" className={data?.theme === "dark" ? "dark" : undefined}>
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: ZOD_JITLESS }} />
        <Meta />
        <Links nonce={nonce} />
      </head>
      <body className="min-h-screen bg-canvas text-ink antialiased">
        {children}
        <ScrollRestoration nonce={nonce} />
        <Scripts nonce={nonce} />
      </body>
    </html>
  );
}

export default function App() {
  return <Outlet />;
}

// Last resort when even the shell cannot render (for example, the database is down).
export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return (
    <main className="mx-auto max-w-2xl p-10">
      <ErrorPanel error={error} />
    </main>
  );
}
