import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Button, buttonClasses } from '@/components/ui/button';
import { PageMessage } from '@/components/ui/page-message';
import { isApiError } from '@/lib/api-client';

/**
 * A team page (or its class board) that did not come: the team does not exist or the user is not a
 * member (404 or 403), or it failed to load (`failedTitle`), when it can be asked for again (`onRetry`). Either
 * way, the way back to the teams.
 */
export function TeamUnavailable({ error, failedTitle, onRetry }: { error: unknown; failedTitle: string; onRetry: () => void }) {
  const notFound = isApiError(error) && (error.status === 404 || error.status === 403);
  return (
    <PageMessage
      variant="in-shell"
      title={notFound ? 'Team not found' : failedTitle}
      actions={
        <>
          {notFound ? null : (
            <Button variant="primary" onClick={onRetry}>
              Try again
            </Button>
          )}
          <Link to={paths.teams} className={buttonClasses('secondary')}>
            Your teams
          </Link>
        </>
      }
    >
      <p>{notFound ? 'This team does not exist, or you are not one of its members.' : isApiError(error) ? error.message : 'It may be the connection.'}</p>
    </PageMessage>
  );
}
