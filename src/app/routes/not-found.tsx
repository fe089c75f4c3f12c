import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { PageMessage } from '@/components/ui/page-message';

export function NotFoundPage() {
  return (
    <PageMessage
      title="Page not found"
      actions={
        <Link to={paths.home} className={buttonClasses('primary')}>
          Go to Home
        </Link>
      }
    >
      <p>There is nothing at this address. The link may be mistyped, or the page has moved.</p>
    </PageMessage>
  );
}
