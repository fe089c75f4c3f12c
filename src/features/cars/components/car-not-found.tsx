import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { PageMessage } from '@/components/ui/page-message';
import { isApiError } from '@/lib/api-client';

/** Whether a car's read failed because the car is gone or not shared with this account (404 or 403). */
export const carIsHidden = (error: unknown) => isApiError(error) && (error.status === 404 || error.status === 403);

/**
 * A car that is gone or not shared with this account: one clear message, not a page of empty sections. Shop staff are
 * sent back to their shop's page.
 */
export function CarNotFound({ forShop = false }: { forShop?: boolean }) {
  return (
    <PageMessage
      variant="in-shell"
      title="Car not found"
      actions={
        <Link to={forShop ? paths.shop : paths.cars} className={buttonClasses('secondary')}>
          {forShop ? 'Back to the shop' : 'Back to your cars'}
        </Link>
      }
    >
      <p>{forShop ? 'Its driver may have deleted it, or taken your shop’s access away.' : 'It may have been deleted, or its driver has not shared it with you.'}</p>
    </PageMessage>
  );
}
