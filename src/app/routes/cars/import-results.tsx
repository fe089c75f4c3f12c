import { useMemo, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { ArrowLeft, Upload } from 'lucide-react';
import { useQueryClient } from '@tanstack/react-query';
import { parseSheet, SheetError, type Sheet, type SheetShape } from '@shared/import/sheet';
import { guessMapping, rowsToRuns, type ColumnMapping } from '@shared/import/mapping';
import { MAX_IMPORT_RUNS } from '@shared/import/import.schema';
import { paths, pathTo } from '@/config/paths';
import { Button, buttonClasses } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SectionCard } from '@/components/ui/section-card';
import { SelectField } from '@/components/ui/select-field';
import { isApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useCar } from '@/features/cars/api/get-car';
import { useEvents } from '@/features/events/api/get-events';
import { runKeys } from '@/features/runs/api/run-keys';
import { useImportResults } from '@/features/imports/api/import-results';
import { ColumnMappingForm } from '@/features/imports/components/column-mapping';
import { FileDrop } from '@/features/imports/components/file-drop';
import { ImportSummary } from '@/features/imports/components/import-summary';
import { RowChooser } from '@/features/imports/components/row-chooser';
import { SheetPreview } from '@/features/imports/components/sheet-preview';
import { localNoon, matchesWhose, readFileText, runsToSend, type WhoseFilter } from '@/features/imports/utils/import-draft';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

const runs = (n: number) => `${n} ${n === 1 ? 'run' : 'runs'}`;

/** Import a club's timing sheet into one car's runs at one event: file, columns, whose rows, import. */
export function ImportResultsPage() {
  const { carId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const queryClient = useQueryClient();
  const { data: me } = useMe();
  const { data: car, isError: carError } = useCar(carId);
  const events = useEvents();
  const eventList = events.data?.items ?? [];
  const eventId = search.get('eventId') ?? eventList[0]?.id ?? '';
  const event = eventList.find((e) => e.id === eventId);

  const [sheet, setSheet] = useState<Sheet | null>(null);
  const [fileName, setFileName] = useState<string | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping | null>(null);
  const [filter, setFilter] = useState<WhoseFilter>({ carNumber: '', driverName: '' });
  const [unticked, setUnticked] = useState<ReadonlySet<number>>(new Set());
  const [driverId, setDriverId] = useState<string | null>(null);
  const mutation = useImportResults(eventId, () => refreshAfterWrite(queryClient, { queryKey: runKeys.all }));

  const rows = useMemo(() => (sheet && mapping ? rowsToRuns(sheet, mapping) : []), [sheet, mapping]);
  const matching = useMemo(() => rows.filter((r) => matchesWhose(r, filter)), [rows, filter]);
  const { runs: toSend, notSent } = useMemo(() => runsToSend(matching.filter((r) => !unticked.has(r.line))), [matching, unticked]);

  const readFile = async (file: File) => {
    mutation.reset();
    setFileName(file.name);
    try {
      const parsed = parseSheet(await readFileText(file));
      const guessed = guessMapping(parsed.header, parsed.shape);
      setSheet(parsed);
      setMapping(guessed);
      setFileError(parsed.rows.length === 0 ? 'The file has column names but no result rows.' : null);
      setUnticked(new Set());
      // The car's number finds its rows best, when the sheet has car numbers; without, the driver's name.
      setFilter(
        car?.carNumber && guessed.columns.carNumber !== null
          ? { carNumber: car.carNumber, driverName: '' }
          : { carNumber: '', driverName: me?.displayName ?? '' },
      );
    } catch (error) {
      setSheet(null);
      setMapping(null);
      setFileError(error instanceof SheetError ? error.message : 'This file could not be read as text. Save it as CSV or TSV and try again.');
    }
  };

  const drivers = car ? [car.owner, ...car.coDrivers] : [];
  const whose = driverId ?? (drivers.some((d) => d.id === me?.id) ? me?.id : drivers[0]?.id) ?? '';
  const timeMissing = mapping?.shape === 'long' && mapping.columns.time === null;
  const tooMany = toSend.length > MAX_IMPORT_RUNS;
  const error = mutation.error;
  const errorText = isApiError(error)
    ? [error.message, ...Object.values(error.fieldErrors).flat()].join(' ')
    : error
      ? 'The import did not go through. Try again.'
      : null;

  const submit = () => {
    if (!event || toSend.length === 0 || tooMany) return;
    mutation.mutate({ carId, driverId: whose || undefined, firstRunAt: localNoon(event.date), runs: toSend });
  };

  return (
    <div className="flex flex-col gap-6">
      <title>{`Import results · ${car?.name ?? 'Car'} · Scrubline`}</title>
      <div className="flex flex-col gap-2">
        <Link to={pathTo.car(carId)} className={buttonClasses('quiet', 'self-start px-2')}>
          <ArrowLeft aria-hidden="true" className="size-5" /> {car?.name ?? 'Car'}
        </Link>
        <h1 className="text-2xl font-bold">Import results</h1>
        <p className="text-ink-muted">
          Bring your runs in from the club’s timing sheet. Runs already logged with the same number are left as they are, so
          importing the same file twice adds nothing.
        </p>
        {carError ? <FormAlert message="This car could not be loaded." /> : null}
      </div>

      <SectionCard title="1. Event and file">
        {events.isPending ? (
          <p className="text-ink-muted">Loading your events…</p>
        ) : eventList.length === 0 ? (
          <p>
            Add the event first, then import its results.{' '}
            <Link to={paths.events} className="font-semibold text-link underline">
              Go to events
            </Link>
          </p>
        ) : (
          <SelectField
            label="Event"
            value={eventId}
            onChange={(e) => {
              mutation.reset();
              setSearch((s) => {
                s.set('eventId', e.target.value);
                return s;
              }, { replace: true });
            }}
            options={eventList.map((e) => ({ value: e.id, label: `${e.name} · ${e.date}` }))}
          />
        )}
        <FileDrop onFile={(f) => void readFile(f)} fileName={fileName} error={fileError} />
      </SectionCard>

      {sheet && mapping ? (
        <>
          <SectionCard title="2. Check the columns">
            <SheetPreview sheet={sheet} />
            <ColumnMappingForm
              header={sheet.header}
              mapping={mapping}
              timeMissing={timeMissing}
              onChange={(m) => {
                mutation.reset();
                setMapping(m);
              }}
              onShapeChange={(shape: SheetShape) => {
                mutation.reset();
                setMapping(guessMapping(sheet.header, shape));
              }}
            />
          </SectionCard>

          <SectionCard title="3. Which rows are yours">
            <RowChooser
              filter={filter}
              onFilterChange={(f) => {
                mutation.reset();
                setFilter(f);
              }}
              rows={matching}
              unticked={unticked}
              onToggle={(line) => {
                mutation.reset();
                setUnticked((prev) => {
                  const next = new Set(prev);
                  if (next.has(line)) next.delete(line);
                  else next.add(line);
                  return next;
                });
              }}
            />
            {drivers.length > 1 ? (
              <SelectField
                label="Whose runs"
                value={whose}
                onChange={(e) => setDriverId(e.target.value)}
                options={drivers.map((d) => ({ value: d.id, label: d.displayName }))}
              />
            ) : null}
          </SectionCard>

          <SectionCard title="4. Import">
            {notSent.length > 0 ? (
              <p className="text-sm text-warning">
                {notSent.length} of the chosen {notSent.length === 1 ? 'entry' : 'entries'} cannot be read and will be listed, not imported.
              </p>
            ) : null}
            {tooMany ? <p className="text-sm font-semibold text-warning">Choose at most {MAX_IMPORT_RUNS} runs at a time.</p> : null}
            <FormAlert message={errorText} />
            {mutation.data ? (
              <>
                <ImportSummary result={mutation.data} notSent={notSent} />
                <Link to={pathTo.event(eventId, carId)} className={buttonClasses('secondary', 'self-start')}>
                  Open the event
                </Link>
              </>
            ) : (
              <Button
                className="self-stretch sm:self-start"
                onClick={submit}
                isPending={mutation.isPending}
                pendingLabel="Importing…"
                disabled={!event || toSend.length === 0 || tooMany}
              >
                <Upload aria-hidden="true" className="size-5" /> Import {runs(toSend.length)}
              </Button>
            )}
          </SectionCard>
        </>
      ) : null}
    </div>
  );
}
