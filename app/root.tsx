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

export function Layout({ children }: { children: React.ReactNode }) {
  const data = useRouteLoaderData<typeof loader>("root");
  return (
    <html lang="en" className={data?.theme === "dark" ? "dark" : undefined}>
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen bg-canvas text-ink antialiased">
        {children}
        <ScrollRestoration />
        <Scripts />
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
