import { useCallback } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { ArrowLeft } from 'lucide-react';
import { paths } from '@/config/paths';
import { NewCarForm } from '@/features/cars/components/new-car-form';

/** A new car; then back to the cars, where it shows as waiting to upload until the server has it. */
export function NewCarPage() {
  const navigate = useNavigate();
  const onSaved = useCallback(() => void navigate(paths.cars, { replace: true }), [navigate]);
  return (
    <div className="flex flex-col gap-6">
      <title>New car · Scrubline</title>
      <div className="flex flex-col gap-2">
        <Link to={paths.cars} className="inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link">
          <ArrowLeft aria-hidden="true" className="size-4" /> Cars
        </Link>
        <h1 className="text-3xl font-extrabold">New car</h1>
      </div>
      <NewCarForm onSaved={onSaved} />
    </div>
  );
}
