import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { recordPath } from '@/config/record-paths';
import { EmptyState } from '@/components/ui/empty-state';
import { useCar } from '@/features/cars/api/get-car';
import { CarNotFound, carIsHidden } from '@/features/cars/components/car-not-found';
import { useSetups } from '@/features/setups/api/get-setups';
import { SuggestionForm } from '@/features/suggestions/components/suggestion-form';
import { BackLink } from '@/components/ui/back-link';

/** Shop staff suggest a change to one of a customer car's setups (?from=<setupId>; the newest when not given). */
export function NewSuggestionPage() {
  const { carId = '' } = useParams();
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const car = useCar(carId);
  const setups = useSetups(carId);
  const from = params.get('from');
  const items = setups.data?.items ?? [];
  // The list is newest first: without ?from, the latest snapshot is the one to change.
  const base = from ? items.find((s) => s.id === from) : items[0];
  if (!car.data && carIsHidden(car.error)) return <CarNotFound forShop />;

  return (
    <div className="flex flex-col gap-6">
      <title>Suggest a change · Scrubline</title>
      <div className="flex flex-col gap-2">
        <BackLink to={recordPath.shopCustomer(carId)}>{car.data?.name ?? 'Car'}</BackLink>
        <h1 className="text-3xl font-extrabold">Suggest a setup change</h1>
        {car.data ? (
          <p className="text-ink-muted">
            For {car.data.owner.displayName}’s {car.data.name}. The drivers see it, and accept or decline it.
          </p>
        ) : null}
      </div>
      {setups.isPending || car.isPending ? (
        <p className="text-ink-muted">Loading the car’s setups…</p>
      ) : setups.isError || car.isError ? (
        <EmptyState message="The car’s setups could not be loaded. Try again shortly." />
      ) : !base ? (
        <EmptyState
          message={
            from
              ? 'That setup snapshot was not found on this car. Pick one from the car’s setup history.'
              : 'This car has no setup recorded yet. A suggestion changes a recorded setup, so the drivers need to record one first.'
          }
        >
          <Link to={recordPath.shopCustomer(carId)} className="font-semibold text-link underline">
            Back to the car
          </Link>
        </EmptyState>
      ) : (
        <div className="max-w-2xl">
          <SuggestionForm carId={carId} adjusters={car.data.damperAdjusters} base={base} onCreated={({ id }) => void navigate(recordPath.suggestion(id))} />
        </div>
      )}
    </div>
  );
}
