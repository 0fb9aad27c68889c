import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { ApiError } from '../lib/api-client';
import { paths } from '../lib/paths';

/** The error boundary of every route. */
export function RouteError() {
  const err = useRouteError();
  let title = 'Something went wrong';
  let message = 'An unexpected error stopped this page.';
  if (isRouteErrorResponse(err)) {
    title = err.status === 404 ? 'Not found' : `Error ${err.status}`;
    message = err.statusText || message;
  } else if (err instanceof ApiError) {
    title = err.status === 404 ? 'Not found' : err.status === 403 ? 'Not allowed' : 'The server could not answer';
    message = err.message;
  } else if (err instanceof Error) message = err.message;
  return (
    <div className="mx-auto max-w-lg p-10">
      <h1>{title}</h1>
      <p className="mt-2 text-ink-soft" role="alert">{message}</p>
      <Link to={paths.home()} className="mt-6 inline-block text-accent underline">Back to productions</Link>
    </div>
  );
}
