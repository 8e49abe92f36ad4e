import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { ErrorState } from '@/components/ui/error-state';
import { paths } from '@/config/paths';

/** Shown when a route fails to load (a module that did not download, a loader that failed). */
export function RouteError() {
  const error = useRouteError();
  const shown = isRouteErrorResponse(error) ? new Error(`${error.status} ${error.statusText}`) : error;
  return (
    <main className="mx-auto max-w-2xl p-8">
      <ErrorState error={shown} title="This page could not be opened" onRetry={() => window.location.reload()} />
      <p className="mt-4">
        <Link className="text-race-700 underline" to={paths.home.getHref()}>
          Go to the home page
        </Link>
      </p>
    </main>
  );
}
