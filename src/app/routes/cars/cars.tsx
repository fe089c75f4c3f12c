import { lazy, Suspense } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Plus } from 'lucide-react';
import { buttonClasses } from '@/components/ui/button';
import { SectionBoundary } from '@/components/errors/section-boundary';
import { useMe } from '@/features/auth/api/get-me';
import { CarList } from '@/features/cars/components/car-list';
import { NEW_CAR_PARAM, NEW_CAR_PATH } from '@/features/cars/utils/new-car-path';

// Loaded when asked for, with the car's edit page that shares its form (car-details-pages.ts).
const NewCarPage = lazy(async () => ({ default: (await import('./car-details-pages')).NewCarPage }));

/** The user's cars; `?new=1` opens the new-car form. */
export function CarsPage() {
  const [params] = useSearchParams();
  const { data: user } = useMe();
  if (params.get(NEW_CAR_PARAM)) {
    return (
      <Suspense fallback={<p className="text-ink-muted">Loading…</p>}>
        <NewCarPage />
      </Suspense>
    );
  }
  if (!user) return null;
  return (
    <div className="flex flex-col gap-6">
      <title>Cars · Scrubline</title>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-3xl font-extrabold">Cars</h1>
        <Link to={NEW_CAR_PATH} className={buttonClasses('primary')}>
          <Plus aria-hidden="true" className="size-5" /> New car
        </Link>
      </div>
      <SectionBoundary title="Your cars">
        <CarList currentUserId={user.id} addWhenEmpty={false} />
      </SectionBoundary>
    </div>
  );
}
