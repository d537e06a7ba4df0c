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

// A title for each refusal we answer with, in our words: the framework's status
// text is not ours ("Method Not Allowed") and, for a refusal thrown on the server,
// not even the status's ("Internal Server Error" for a 410).
const TITLES: Record<number, string> = {
  400: "The request could not be read",
  401: "Please sign in",
  403: "Your role cannot do this",
  404: "There is no page here",
  405: "This page takes no form",
  409: "This clashes with a change made meanwhile",
  410: "This link no longer works",
  413: "That was too large to take",
  415: "That kind of content is not taken here",
  422: "That could not be used",
  429: "Too many requests for now",
  503: "This is not available right now",
};

const DETAILS: Record<number, string> = {
  401: "This page needs you signed in.",
  403: "Ask an owner of the workspace for access.",
  404: "The address may be mistyped, or the robot or gait it pointed to was removed.",
  // The framework's own text for this names route modules: it is not for people.
  405: "Something sent a form to an address that only shows a page, so nothing was changed. Open the page and use its own buttons.",
  410: "The link was used, withdrawn or has expired.",
};

function describe(error: unknown): { status: number; title: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    const message = typeof error.data === "string" ? error.data : error.data?.message;
    const ours = error.status !== 405 && typeof message === "string" ? message : undefined;
    return {
      status: error.status,
      title: TITLES[error.status] ?? (error.status >= 500 ? "Something broke on our side" : "The request was refused"),
      detail: ours ?? DETAILS[error.status] ?? "Go back and try again; if it keeps happening, tell the owner of the workspace.",
    };
  }
  return {
    status: 500,
    title: "Something broke on our side",
    detail:
      "Nothing you saved was lost. Try again in a moment; if it keeps happening, the server log has the details." +
      (error instanceof Error && import.meta.env.DEV ? ` (${error.message})` : ""),
  };
}
