import { useState, type FormEvent } from 'react';
import {
  formatQuantity,
  IMPERIAL_PREFERENCES,
  METRIC_PREFERENCES,
  UNIT_SYMBOLS,
  type UnitPreferences,
} from '@shared/calc/units.calc';
import type { User } from '@shared/auth/auth.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { isApiError } from '@/lib/api-client';
import { SAVE_BAR_CLASSES } from '@/components/layouts/save-bar';
import { useUpdatePreferences } from '../api/update-preferences';

/** The quantities a user may choose a unit for (angles are always degrees, times always seconds). */
const CHOICES = [
  { quantity: 'pressure', label: 'Tyre pressure', sample: 220, options: ['kPa', 'bar', 'psi'] },
  { quantity: 'length', label: 'Lengths (toe, ride height)', sample: 120, options: ['mm', 'in'] },
  { quantity: 'treadDepth', label: 'Tread depth', sample: 6.35, options: ['mm', 'in32'] },
  { quantity: 'springRate', label: 'Spring rate', sample: 70, options: ['N/mm', 'kgf/mm', 'lbf/in'] },
  { quantity: 'mass', label: 'Mass (corner weight)', sample: 250, options: ['kg', 'lb'] },
  { quantity: 'temperature', label: 'Temperature', sample: 25, options: ['degC', 'degF'] },
] as const;

type Choosable = (typeof CHOICES)[number]['quantity'];
type Choices = Pick<UnitPreferences, Choosable>;

const pick = (units: UnitPreferences): Choices => ({
  pressure: units.pressure,
  length: units.length,
  treadDepth: units.treadDepth,
  springRate: units.springRate,
  mass: units.mass,
  temperature: units.temperature,
});

const same = (a: Choices, b: Choices) => CHOICES.every(({ quantity }) => a[quantity] === b[quantity]);

const OFFLINE_MESSAGE = 'No connection: your units were not saved. They are still chosen here; save again when you have signal.';

/** Choose units as a whole (metric, imperial) or one quantity at a time; saved to the account, so every device agrees. */
export function UnitSettingsForm({ user }: { user: User }) {
  const saved = pick(user.preferences.units);
  const [draft, setDraft] = useState<Choices>(saved);
  const [message, setMessage] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const update = useUpdatePreferences();
  const full: UnitPreferences = { ...user.preferences.units, ...draft };
  const unsaved = !same(draft, saved);

  const setPreset = (preset: UnitPreferences) => {
    setDraft(pick(preset));
    setMessage(null);
  };

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    setError(null);
    setMessage(null);
    update.mutate(
      { units: draft },
      {
        onSuccess: () => setMessage('Units saved. Every screen now shows these units.'),
        onError: (e) => setError(isApiError(e) && e.code === 'network' ? OFFLINE_MESSAGE : e.message || OFFLINE_MESSAGE),
      },
    );
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Units" className="flex flex-col gap-5">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-2 font-semibold">Start from a set</legend>
        <div className="flex flex-wrap gap-2">
          <Button
            variant={same(draft, pick(METRIC_PREFERENCES)) ? 'primary' : 'secondary'}
            aria-pressed={same(draft, pick(METRIC_PREFERENCES))}
            onClick={() => setPreset(METRIC_PREFERENCES)}
          >
            Metric
          </Button>
          <Button
            variant={same(draft, pick(IMPERIAL_PREFERENCES)) ? 'primary' : 'secondary'}
            aria-pressed={same(draft, pick(IMPERIAL_PREFERENCES))}
            onClick={() => setPreset(IMPERIAL_PREFERENCES)}
          >
            Imperial
          </Button>
        </div>
        <p className="text-sm text-ink-muted">Or choose each one below. Values are stored in metric and shown in what you pick.</p>
      </fieldset>

      {CHOICES.map(({ quantity, label, sample, options }) => (
        <div key={quantity} className="flex flex-col gap-1">
          <SegmentedControl
            label={label}
            name={quantity}
            options={options.map((u) => ({ value: u, label: u === 'in32' ? '1/32 in' : UNIT_SYMBOLS[u] }))}
            value={draft[quantity]}
            onChange={(value) => {
              setDraft((d) => ({ ...d, [quantity]: value }));
              setMessage(null);
            }}
          />
          <p className="tabular-figures text-sm text-ink-muted">For example: {formatQuantity(sample, quantity, full)}</p>
        </div>
      ))}

      <FormAlert message={error} />
      {/* Live regions stay in the page to be heard, but take no room while they have nothing to say. */}
      <p aria-live="polite" className="font-semibold text-success empty:sr-only">
        {message}
      </p>
      {/* A choice not yet saved keeps Save in reach above the bottom bar, and says it: leaving the page drops it. */}
      <div className={unsaved ? SAVE_BAR_CLASSES : 'flex flex-col gap-2'}>
        <p aria-live="polite" className="text-sm font-semibold empty:sr-only">
          {unsaved && !update.isPending ? 'Not saved yet: the app keeps showing your old units until you save.' : null}
        </p>
        <Button type="submit" isPending={update.isPending} pendingLabel="Saving…" disabled={!unsaved && !error} className="w-full md:w-auto">
          Save units
        </Button>
      </div>
    </form>
  );
}
