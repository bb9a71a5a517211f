import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { Wordmark } from '@console/components/brand/wordmark';
import { ProblemAlert } from '@console/components/ui/alert';
import { Button, buttonClasses } from '@console/components/ui/button';

/** Catches what a screen throws (a failed loader, a broken render) so the rest of the console stays usable. */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;
  return (
    <div className="mx-auto flex min-h-[60vh] max-w-xl flex-col justify-center gap-6 px-6 py-12">
      <title>Something went wrong · Sweepline</title>
      <Wordmark tone="dark" />
      <h1 className="text-2xl font-extrabold text-ink-900">
        {notFound ? 'This page does not exist' : 'This screen could not be shown'}
      </h1>
      {!notFound && <ProblemAlert error={isRouteErrorResponse(error) ? new Error(error.statusText) : error} />}
      <div className="flex gap-3">
        <Button onClick={() => window.location.reload()}>Reload</Button>
        <Link to="/" className={buttonClasses('secondary')}>
          Go to the overview
        </Link>
      </div>
    </div>
  );
}
