import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { useArrival } from '../../components/ui/use-arrival';

/** The error boundary of every route: says what happened in plain words and offers a way back. */
export function RouteError() {
  const error = useRouteError();
  const heading = useArrival('This screen could not be shown');
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <div role="alert" className="mx-auto mt-16 max-w-xl rounded-lg border-2 border-alert bg-card p-6">
      <h1 ref={heading} tabIndex={-1} className="text-2xl font-bold text-alert">
        This screen could not be shown
      </h1>
      <p className="mt-2">Nothing you entered was sent twice. Reload the page, or go back to your start screen.</p>
      <p className="mt-2 text-sm text-ink-soft">Details: {message}</p>
      <div className="mt-4 flex gap-4">
        <button type="button" className="font-bold text-harbour underline" onClick={() => window.location.reload()}>
          Reload
        </button>
        <Link className="font-bold text-harbour underline" to="/">
          Start screen
        </Link>
      </div>
    </div>
  );
}
