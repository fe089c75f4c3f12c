import { Fragment } from 'react';
import type { Car } from '@shared/season/car.schema';
import { SETUP_CORNER_FIELDS, type Setup } from '@shared/season/setup.schema';
import { CornerGrid } from '@/components/corner-grid/corner-grid';
import { Caution } from '@/components/ui/caution';
import { formatDateTime, formatDay } from '@/lib/dates';
import { FIELD_INFO, formatFieldValue } from '@/lib/setup-fields';
import { useUnits } from '@/lib/units-context';

interface SetupSheetProps {
  car: Pick<Car, 'name' | 'classCode' | 'carNumber' | 'tyreSize'>;
  setup: Pick<Setup, 'label' | 'effectiveFrom' | 'createdBy' | 'corners' | 'axles' | 'notes'>;
  /** When the sheet was printed (today). */
  printedOn?: Date;
}

/**
 * One setup snapshot on one sheet of paper: the car, the snapshot's name and date, every corner
 * value in the reader's units, the anti-roll bars and the notes. Sized so it prints on one A4 or
 * Letter page.
 */
export function SetupSheet({ car, setup, printedOn = new Date() }: SetupSheetProps) {
  const units = useUnits();
  const about = [`Class ${car.classCode}`, car.carNumber ? `No. ${car.carNumber}` : null, car.tyreSize ? `Tyres ${car.tyreSize}` : null]
    .filter(Boolean)
    .join(' · ');
  return (
    <article aria-labelledby="setup-sheet-title" className="flex flex-col gap-4 print:gap-2 print:text-[10pt] print:leading-tight">
      <header className="flex flex-col gap-1 border-b border-line pb-2">
        <p className="text-sm font-semibold tracking-wide text-ink-muted uppercase">Setup sheet</p>
        <h1 id="setup-sheet-title" className="text-2xl font-bold print:text-[16pt]">
          {car.name}
        </h1>
        <p className="text-ink-muted">{about}</p>
      </header>

      <section aria-label="The snapshot" className="flex flex-col gap-1">
        <h2 className="text-xl font-bold print:text-[13pt]">{setup.label}</h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm tabular-figures">
          <dt className="font-semibold">In force from</dt>
          <dd>{formatDateTime(setup.effectiveFrom)}</dd>
          <dt className="font-semibold">Recorded by</dt>
          <dd>{setup.createdBy.displayName || 'someone'}</dd>
          <dt className="font-semibold">Printed</dt>
          <dd>{formatDay(printedOn)}</dd>
        </dl>
      </section>

      <CornerGrid
        label="Setup values by corner"
        title={<h2 className="text-lg font-bold print:text-[12pt]">Corners</h2>}
        renderCorner={(corner) => (
          <dl className="grid grid-cols-[minmax(0,1fr)_auto] gap-x-2 gap-y-0.5 text-sm print:gap-y-0">
            {SETUP_CORNER_FIELDS.map((field) => (
              <Fragment key={field}>
                <dt className="text-ink-muted">{FIELD_INFO[field].label}</dt>
                <dd className="text-right font-semibold whitespace-nowrap tabular-figures">{formatFieldValue(field, setup.corners[corner]?.[field], units)}</dd>
              </Fragment>
            ))}
          </dl>
        )}
      />

      <section aria-label="Axles" className="flex flex-col gap-1">
        <h2 className="text-lg font-bold print:text-[12pt]">Anti-roll bars</h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="font-semibold">Front</dt>
          <dd>{setup.axles.front.antiRollBar ?? '—'}</dd>
          <dt className="font-semibold">Rear</dt>
          <dd>{setup.axles.rear.antiRollBar ?? '—'}</dd>
        </dl>
      </section>

      <section aria-label="Notes" className="flex flex-col gap-1">
        <h2 className="text-lg font-bold print:text-[12pt]">Notes</h2>
        <p className="text-sm whitespace-pre-line">{setup.notes || 'No notes.'}</p>
      </section>

      <Caution title="A record, not instructions">
        <p>
          These settings are what was recorded on this car, not a recipe. Follow the vehicle maker&apos;s figures and torque specs, and have
          alignment and suspension work checked by a competent person before the car is driven.
        </p>
      </Caution>
    </article>
  );
}
