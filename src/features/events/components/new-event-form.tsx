import { useMemo, useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { CreateEventInput } from '@shared/season/event.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { todayIsoDate } from '@/lib/dates';
import { unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { createEventEntry, useCreateEvent, type CreateEventBody } from '../api/create-event';
import { emptyEventForm, eventFormSchema, type EventFormValues } from '../utils/event-form';

const KIND_OPTIONS = [
  { value: 'autocross', label: 'Autocross' },
  { value: 'track_day', label: 'Track day' },
] as const;

interface NewEventFormProps {
  /** Called once the event is stored on this phone (before it is uploaded), with its id. */
  onSaved: (eventId: string) => void;
}

/**
 * A new event: name, day, venue, kind, cone penalty and conditions, in the user's units. Saved on
 * the phone through the outbox with an id made here, so it works with no signal at all.
 */
export function NewEventForm({ onSaved }: NewEventFormProps) {
  const units = useUnits();
  const write = useCreateEvent();
  const [formError, setFormError] = useState<string | null>(null);
  const resolver = useMemo(() => zodResolver(eventFormSchema(units)), [units]);
  const [defaults] = useState(() => emptyEventForm(todayIsoDate()));
  const { register, handleSubmit, control, formState } = useForm<EventFormValues, unknown, CreateEventInput>({
    resolver,
    defaultValues: defaults,
  });
  const errors = formState.errors;
  const kind = useWatch({ control, name: 'kind' });
  const tempUnit = unitSymbol('temperature', units);

  const onSubmit = handleSubmit(async (input) => {
    setFormError(null);
    const body: CreateEventBody = { ...input, id: crypto.randomUUID() };
    try {
      await write.mutateAsync(createEventEntry(body));
    } catch {
      setFormError('The event could not be stored on this phone. Nothing was sent; try again.');
      return;
    }
    onSaved(body.id);
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="New event" className="flex max-w-form flex-col gap-5">
      <TextField label="Event name" autoCapitalize="words" maxLength={120} placeholder="e.g. Club autocross, round 3" error={errors.name?.message} {...register('name')} />
      <TextField label="Date" type="date" error={errors.date?.message} {...register('date')} />
      <Controller
        control={control}
        name="kind"
        render={({ field }) => <SegmentedControl label="Kind of event" options={KIND_OPTIONS} value={field.value} onChange={field.onChange} />}
      />
      {kind === 'autocross' || errors.conePenaltySec ? (
        <UnitInput
          label="Cone penalty"
          unit="s per cone"
          className="max-w-60"
          hint="2 s per cone is common practice; use your club’s rule."
          error={errors.conePenaltySec?.message}
          {...register('conePenaltySec')}
        />
      ) : null}
      <TextField label="Venue (optional)" autoCapitalize="words" maxLength={120} error={errors.venue?.message} {...register('venue')} />
      <TextField
        label="Surface (optional)"
        maxLength={80}
        placeholder="e.g. old concrete, fresh asphalt"
        error={errors.surface?.message}
        {...register('surface')}
      />
      <fieldset className="flex min-w-0 flex-col gap-2">
        <legend className="mb-1 font-semibold">
          Conditions <span className="font-normal text-ink-muted">(optional, in {tempUnit})</span>
        </legend>
        <div className="grid grid-cols-2 gap-3">
          <UnitInput label="Air temperature" unit={tempUnit} signed error={errors.airTempC?.message} {...register('airTempC')} />
          <UnitInput label="Track temperature" unit={tempUnit} signed error={errors.trackTempC?.message} {...register('trackTempC')} />
        </div>
      </fieldset>
      <FormAlert message={formError} />
      <Button type="submit" className="min-h-tap-lg w-full text-lg" isPending={write.isPending || formState.isSubmitting} pendingLabel="Saving…">
        Save and open event day
      </Button>
      <p className="text-sm text-ink-muted">Saved on this phone first; it uploads by itself when there is signal, before any run you log at it.</p>
    </form>
  );
}
