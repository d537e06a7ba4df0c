import { Link, isRouteErrorResponse, useRouteError } from "react-router";

/** What went wrong, in words a person can act on, for 404s, refusals and crashes. */
export function ErrorPanel({ error }: { error: unknown }) {
  const { status, title, detail } = describe(error);
  return (
    <section role="alert" className="rounded-lg border border-line bg-surface p-8 shadow-sm">
      <p className="font-mono text-sm text-ink-muted">Error {status}</p>
      <h1 className="mt-1 text-2xl font-semibold">{title}</h1>
      <p className="mt-3 text-ink-muted">{detail}</p>
      {import.meta.env.DEV && error instanceof Error && error.stack ? (
        <pre className="mt-4 max-h-64 overflow-auto rounded bg-sunken p-3 text-xs">{error.stack}</pre>
      ) : null}
      <p className="mt-6">
        <Link to="/" className="font-medium text-accent underline underline-offset-4">
          Back to the start page
        </Link>
      </p>
    </section>
  );
}

/**
 * A page's ErrorBoundary: the panel in the page column. Route modules export
 * it as theirs (`export { RouteErrorBoundary as ErrorBoundary } from …`); it
 * reads the error itself, as a re-exported boundary is handed no props.
 */
export function RouteErrorBoundary() {
  return (
    <div className="mx-auto max-w-2xl py-10">
      <ErrorPanel error={useRouteError()} />
    </div>
  );
}

function describe(error: unknown): { status: number; title: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    const message = typeof error.data === "string" ? error.data : error.data?.message;
    if (error.status === 404) {
      return {
        status: 404,
        title: "There is no page here",
        detail: message ?? "The address may be mistyped, or the robot or gait it pointed to was removed.",
      };
    }
    if (error.status === 401) return { status: 401, title: "Please sign in", detail: message ?? "This page needs you signed in." };
    if (error.status === 403) {
      return { status: 403, title: "Your role cannot do this", detail: message ?? "Ask an owner of the workspace for access." };
    }
    return { status: error.status, title: error.statusText || "Request failed", detail: message ?? "" };
  }
  return {
    status: 500,
    title: "Something broke on our side",
    detail:
      "Nothing you saved was lost. Try again in a moment; if it keeps happening, the server log has the details." +
      (error instanceof Error && import.meta.env.DEV ? ` (${error.message})` : ""),
  };
}
