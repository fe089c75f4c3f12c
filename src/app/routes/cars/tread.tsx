import { useCallback } from 'react';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { SectionCard } from '@/components/ui/section-card';
import { formatDateTime } from '@/lib/dates';
import { toast } from '@/lib/toast-store';
import { AttachmentToggle } from '@/features/attachments/components/attachment-toggle';
import { useCar } from '@/features/cars/api/get-car';
import { CarNotFound, carIsHidden } from '@/features/cars/components/car-not-found';
import { CommentToggle } from '@/features/comments/components/comment-toggle';
import { DeleteReadingButton } from '@/features/tyres/components/delete-reading-button';
import { NewTyreSetForm } from '@/features/tyres/components/new-tyre-set-form';
import { ReadingHistory } from '@/features/tyres/components/reading-history';
import { TreadDisplay } from '@/features/tyres/components/tread-display';
import { TreadEntryForm } from '@/features/tyres/components/tread-entry-form';
import { useTyreSetViews } from '@/features/tyres/hooks/use-tyre-set-views';
import { runsOnSetText } from '@/features/tyres/utils/tread';
import { BackLink } from '@/components/ui/back-link';

/** Tread depths of one tyre set (?set=<tyreSetId> to preselect it). */
export function TreadPage() {
  const { carId = '' } = useParams();
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const car = useCar(carId);
  // Sets made on this phone count too: a reading of one waits behind the set's own upload.
  const sets = useTyreSetViews(carId);
  // Each set's latest saved reading in full (the form shows it only faintly, and only until a box is typed in),
  // with its photos and its thread (the shop and the drivers talk about the wear); the set's earlier readings,
  // with their photos, are folded under it.
  const readings = sets.sets.flatMap((set) => (set.latestReading ? [{ set, reading: set.latestReading }] : []));
  const onUploaded = useCallback(() => {
    toast({ tone: 'success', title: 'Tread reading saved' });
    void navigate(pathTo.car(carId));
  }, [navigate, carId]);
  if (!car.data && carIsHidden(car.error)) return <CarNotFound />;

  return (
    <div className="flex flex-col gap-6">
      <title>Tread · Scrubline</title>
      <div className="flex flex-col gap-2">
        <BackLink to={pathTo.car(carId)}>{car.data?.name ?? 'Car'}</BackLink>
        <h1 className="text-3xl font-extrabold">Tread depth</h1>
      </div>
      {sets.isPending ? (
        <p className="text-ink-muted">Loading tyre sets…</p>
      ) : sets.isError ? (
        <EmptyState message="Tyre sets could not be loaded. Try again when you have signal." />
      ) : sets.sets.length === 0 ? (
        // No dead end: the set is added here, and the tread form takes its place once it is.
        <EmptyState message="This car has no tyre set yet. Add the set on the car; its tread goes in next.">
          <NewTyreSetForm carId={carId} defaultSize={car.data?.tyreSize ?? null} onSaved={() => undefined} />
        </EmptyState>
      ) : (
        <TreadEntryForm carId={carId} sets={sets.sets} initialSetId={params.get('set')} onUploaded={onUploaded} />
      )}
      {readings.length > 0 ? (
        <SectionCard title="Latest readings">
          <ul className="flex flex-col gap-3" aria-label="Latest reading of each set">
            {readings.map(({ set, reading }) => (
              <li key={set.id} className="flex flex-col gap-2 rounded border border-line p-3">
                <p>
                  <span className="font-bold">{set.label}</span>{' '}
                  <span className="tabular-figures text-sm text-ink-muted">
                    · {[formatDateTime(reading.takenAt), runsOnSetText(reading)].filter(Boolean).join(', ')}
                  </span>
                </p>
                <TreadDisplay corners={reading.corners} />
                <AttachmentToggle target={{ targetType: 'tread_reading', targetId: reading.id }} what={`the ${set.label} reading`} defaultOpen />
                <CommentToggle target={{ type: 'tread_reading', id: reading.id }} what={`the ${set.label} reading`} />
                <div>
                  <DeleteReadingButton tyreSetId={set.id} readingId={reading.id} setLabel={set.label} takenAt={reading.takenAt} />
                </div>
                <ReadingHistory
                  tyreSetId={set.id}
                  setLabel={set.label}
                  latestReadingId={reading.id}
                  renderReadingExtras={(earlier) => (
                    <AttachmentToggle
                      target={{ targetType: 'tread_reading', targetId: earlier.id }}
                      what={`the ${set.label} reading of ${formatDateTime(earlier.takenAt)}`}
                    />
                  )}
                />
              </li>
            ))}
          </ul>
        </SectionCard>
      ) : null}
    </div>
  );
}
