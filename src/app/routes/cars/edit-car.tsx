import { Link, useNavigate, useParams } from 'react-router-dom';
import { paths, pathTo } from '@/config/paths';
import { PageMessage } from '@/components/ui/page-message';
import { buttonClasses } from '@/components/ui/button';
import { toast } from '@/lib/toast-store';
import { useMe } from '@/features/auth/api/get-me';
import { useCar } from '@/features/cars/api/get-car';
import { CarNotFound, carIsHidden } from '@/features/cars/components/car-not-found';
import { DeleteCar } from '@/features/cars/components/delete-car';
import { EditCarForm } from '@/features/cars/components/edit-car-form';
import { BackLink } from '@/components/ui/back-link';

/** The car's own details and deleting it: its owner's page. A co-driver is told who can change it. */
export function EditCarPage() {
  const carId = useParams().carId!;
  const navigate = useNavigate();
  const { data: car, isPending, error } = useCar(carId);
  const { data: me } = useMe();
  if (!car && carIsHidden(error)) return <CarNotFound />;
  if (car && me && car.owner.id !== me.id) {
    return (
      <PageMessage
        variant="in-shell"
        title={`Only ${car.owner.displayName} can change this car`}
        actions={
          <Link to={pathTo.car(carId)} className={buttonClasses('secondary')}>
            Back to {car.name}
          </Link>
        }
      >
        <p>A car&rsquo;s details belong to its owner; ask them if something here is wrong.</p>
      </PageMessage>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      <title>{`Edit ${car?.name ?? 'car'} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <BackLink to={pathTo.car(carId)}>{car?.name ?? 'Car'}</BackLink>
        <h1 className="text-3xl font-extrabold">Edit {car?.name ?? 'car'}</h1>
      </div>
      {car ? (
        <>
          <EditCarForm
            car={car}
            onSaved={() => {
              toast({ tone: 'success', title: 'Car saved' });
              // The car's page in this one's place (Back leads on past it), from its top, where the changes show.
              void navigate(pathTo.car(carId), { replace: true });
              window.scrollTo(0, 0);
            }}
          />
          <DeleteCar car={car} onDeleted={() => void navigate(paths.cars, { replace: true })} />
        </>
      ) : isPending ? (
        <p className="text-ink-muted">Loading…</p>
      ) : (
        <p className="text-ink-muted">This car could not be loaded. Try again when you have signal.</p>
      )}
    </div>
  );
}
