import { useState, type ReactNode } from 'react';
import { useParams } from 'react-router-dom';
import { fromDisplay, unitFor, type UnitPreferences } from '@shared/calc/units.calc';
import { pathTo } from '@/config/paths';
import { EmptyState } from '@/components/ui/empty-state';
import { useUnits } from '@/lib/units-context';
import { useCar } from '@/features/cars/api/get-car';
import { CarNotFound, carIsHidden } from '@/features/cars/components/car-not-found';
import { useChanges } from '@/features/changes/api/get-changes';
import { SetupChangeList } from '@/features/setups/components/setup-change-list';
import { DEFAULT_MIN_DEPTH_MM, useSeason } from '@/features/analysis/api/get-season';
import { CompareSection } from '@/features/analysis/components/compare-section';
import { useSetups } from '@/features/setups/api/get-setups';
import { ScatterSection } from '@/features/analysis/components/scatter-section';
import { SeasonTimeline } from '@/features/analysis/components/season-timeline';
import { TyreLife } from '@/features/analysis/components/tyre-life';
import { CardSection } from '@/components/layouts/card-section';
import { BackLink } from '@/components/ui/back-link';

/** 1.6 mm, or exactly 2/32 in for someone who reads tread in 1/32 in. */
function defaultMinDepthMm(units: UnitPreferences): number {
  return unitFor('treadDepth', units) === 'in32' ? fromDisplay(2, 'treadDepth', units) : DEFAULT_MIN_DEPTH_MM;
}

function ChangesCompare({ carId }: { carId: string }) {
  const changes = useChanges(carId);
  const setups = useSetups(carId);
  const { data: car } = useCar(carId);
  if (changes.isPending || setups.isPending) return <p className="text-ink-muted">Loading the changes…</p>;
  if (changes.isError || setups.isError) return <EmptyState message="The changes could not be loaded. Try again shortly." />;
  return (
    <CompareSection
      carId={carId}
      changes={changes.data.items}
      setups={setups.data.items}
      renderChanges={(list) => <SetupChangeList changes={list} adjusters={car?.damperAdjusters} />}
    />
  );
}

function SeasonSections({ carId }: { carId: string }) {
  const units = useUnits();
  const [minDepthMm, setMinDepthMm] = useState(() => defaultMinDepthMm(units));
  const season = useSeason(carId, minDepthMm);
  const { data: car } = useCar(carId);
  const body = (render: (data: NonNullable<typeof season.data>) => ReactNode) =>
    season.isPending ? (
      <p className="text-ink-muted">Loading the season…</p>
    ) : season.isError ? (
      <EmptyState message="The season could not be loaded. Try again shortly." />
    ) : (
      render(season.data)
    );

  return (
    <>
      <CardSection title="Season timeline">
        {body((data) => (
          <SeasonTimeline season={data} renderChanges={(changes) => <SetupChangeList changes={changes} adjusters={car?.damperAdjusters} />} />
        ))}
      </CardSection>
      <CardSection title="Tyre life">
        {body((data) => (
          <TyreLife
            tyreLife={data.tyreLife}
            minDepthMm={minDepthMm}
            onMinDepthChange={setMinDepthMm}
            isUpdating={season.isPlaceholderData}
          />
        ))}
      </CardSection>
    </>
  );
}

/**
 * Reading one car's season calmly, at home: setup values against time and wear, before and after a change,
 * the season's timeline, and tyre life. Meant for /cars/:carId/review. Charts load in their own chunk.
 */
export function SeasonReviewPage() {
  const { carId = '' } = useParams();
  const car = useCar(carId);
  const name = car.data?.name ?? 'Car';
  // Gone or not shared: said once, rather than each section failing to load.
  if (!car.data && carIsHidden(car.error)) return <CarNotFound />;
  return (
    <div className="flex flex-col gap-6">
      <title>{`Season review · ${name} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <BackLink to={pathTo.car(carId)}>{name}</BackLink>
        <h1 className="text-3xl font-extrabold">Season review</h1>
        <p className="text-ink-muted">
          What the season&apos;s numbers say, with how many there are and how sure they are. Few points mean a weak answer:
          where there are too few, it says so.
        </p>
      </div>
      <CardSection title="Setup against time and wear">
        <ScatterSection carId={carId} />
      </CardSection>
      <CardSection title="Before and after a change">
        <ChangesCompare carId={carId} />
      </CardSection>
      <SeasonSections carId={carId} />
    </div>
  );
}
