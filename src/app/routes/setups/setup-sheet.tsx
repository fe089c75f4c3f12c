import { Link, useParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { ArrowLeft, Printer } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { PageMessage } from '@/components/ui/page-message';
import { isApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { carQueryOptions } from '@/features/cars/api/get-car';
import { carPagePath } from '@/features/cars/utils/car-page-path';
import { useSetupForSheet } from '@/features/exports/api/get-setup-for-sheet';
import { SetupSheet } from '@/features/exports/components/setup-sheet';

/** One snapshot as a printable sheet (the print styles keep it to one A4 or Letter page). */
export function SetupSheetPage() {
  const { setupId = '' } = useParams();
  const setup = useSetupForSheet(setupId);
  const carId = setup.data?.carId ?? '';
  const car = useQuery({ ...carQueryOptions(carId), enabled: carId !== '' });
  const { data: me } = useMe();

  if (setup.isError || car.isError) {
    const missing = [setup.error, car.error].some((e) => isApiError(e) && e.status === 404);
    return (
      <PageMessage variant="in-shell" title={missing ? 'Setup not found' : 'The setup could not be loaded'}>
        <p>{missing ? 'It may have been deleted, or it belongs to a car you cannot see.' : 'Try again shortly.'}</p>
      </PageMessage>
    );
  }
  if (!setup.data || !car.data || !me) return <p className="text-ink-muted">Loading the setup…</p>;

  return (
    <div className="setup-sheet mx-auto flex w-full max-w-3xl flex-col gap-4 print:max-w-none">
      <title>{`${setup.data.label} · ${car.data.name} · Scrubline`}</title>
      <div className="flex flex-wrap items-center gap-3 print:hidden">
        <Link to={`${carPagePath(car.data, me.id)}#setup-${setupId}`} className="inline-flex min-h-tap items-center gap-1 font-semibold text-link wrap-anywhere">
          <ArrowLeft aria-hidden="true" className="size-5" /> {car.data.name}
        </Link>
        <Button variant="primary" onClick={() => window.print()}>
          <Printer aria-hidden="true" className="size-5" /> Print
        </Button>
      </div>
      <SetupSheet car={car.data} setup={setup.data} />
    </div>
  );
}
