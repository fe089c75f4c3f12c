import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { buttonClasses } from '@/components/ui/button';
import { PageMessage } from '@/components/ui/page-message';

function describe(error: unknown): { title: string; detail: string } {
  if (isApiError(error)) {
    if (error.code === 'network') return { title: 'No connection', detail: error.message };
    return { title: 'This page could not load', detail: error.message };
  }
  if (isRouteErrorResponse(error) && error.status === 404) {
    return { title: 'Page not found', detail: 'There is no page at this address.' };
  }
  // A new version of the app was deployed and an old page file is gone.
  if (error instanceof TypeError && /dynamically imported module|Importing a module script failed/i.test(error.message)) {
    return { title: 'Scrubline was updated', detail: 'Reload to get the new version. Nothing you saved is lost.' };
  }
  return { title: 'Something went wrong', detail: 'This page hit a problem. Nothing you saved is lost.' };
}

/**
 * The router's errorElement: a failed loader, a failed page download or a page that crashed.
 * Inside the shell (`in-shell`) the top bar and navigation stay usable.
 */
export function RouteError({ variant = 'page' }: { variant?: 'page' | 'in-shell' }) {
  const error = useRouteError();
  const { title, detail } = describe(error);
  return (
    <PageMessage
      variant={variant}
      title={title}
      actions={
        <>
          <button type="button" className={buttonClasses('primary')} onClick={() => window.location.reload()}>
            Reload
          </button>
          <Link to={paths.home} className={buttonClasses('secondary')} reloadDocument>
            Go to Home
          </Link>
        </>
      }
    >
      <p>{detail}</p>
    </PageMessage>
  );
}
