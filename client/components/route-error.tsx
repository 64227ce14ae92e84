import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';

/** Shown when a page fails to render or load. */
export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <div className="mx-auto max-w-xl px-6 py-16">
      <h1 className="text-2xl font-semibold">This page could not be shown</h1>
      <p className="mt-3 font-mono text-sm text-beyond">{message}</p>
      <Link to="/" className="mt-6 inline-block underline">
        Back to the start page
      </Link>
    </div>
  );
}
