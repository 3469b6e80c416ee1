import { isRouteErrorResponse, Link, useRouteError } from "react-router";
import { messageOf } from "~/lib/validation";


const TITLES: Record<number, string> = {
  400: "That request could not be understood",
  403: "This page is not open to you",
  404: "Nothing here",
  429: "Too many attempts",
};

/** One error display for every route: status-specific titles, the server's message, a way back. */
export function GeneralErrorBoundary() {
  const error = useRouteError();
  if (isRouteErrorResponse(error)) {
    const message = messageOf(error.data) ?? (error.status === 404 ? "We could not find that page. It may have moved, or the link may be mistyped." : error.statusText);
    return (
      <section role="alert" className="card my-8">
        <p className="font-sans text-sm text-ink-soft">Error {error.status}</p>
        <h1 className="mt-1 text-2xl">{TITLES[error.status] ?? "Something went wrong"}</h1>
        <p className="mt-3">{message}</p>
        <p className="mt-4 font-sans">
          <Link to="/studio">Go to the studio</Link> · <Link to="/">Eonscale home</Link>
        </p>
      </section>
    );
  }
  const dev = import.meta.env.DEV;
  return (
    <section role="alert" className="card my-8">
      <h1 className="text-2xl">Something went wrong on our side</h1>
      <p className="mt-3">The problem has been logged. Try again in a moment.</p>
      {dev && error instanceof Error ? <pre className="mt-4 overflow-auto text-xs">{error.stack}</pre> : null}
    </section>
  );
}
