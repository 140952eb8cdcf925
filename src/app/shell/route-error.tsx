import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { ErrorFallback } from '../../components/error-fallback';
import { isApiError } from '../../lib/api-client';

/** Route errorElement: a calm message and a way home, whatever went wrong. */
export function RouteError() {
  const error = useRouteError();
  console.error(error);

  if (isRouteErrorResponse(error) && error.status === 404) {
    return <ErrorFallback title="Page not found" message="There is no page at this address." />;
  }
  // A new version was deployed while this tab was open and an old page chunk is gone.
  if (error instanceof TypeError && /dynamically imported module|Importing a module script/i.test(error.message)) {
    return <ErrorFallback title="Nestkeeper was updated" message="A newer version is available. Reload the page to continue." />;
  }
  if (isApiError(error) && error.status === 0) {
    return <ErrorFallback title="The server cannot be reached" message={error.message} />;
  }
  return <ErrorFallback />;
}
