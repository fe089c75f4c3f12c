import { useId, type ReactNode } from 'react';
import { Controller, useForm, useWatch, type Control, type FieldErrors, type UseFormRegister, type UseFormSetError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { CreateCarInput } from '@shared/season/car.schema';
import { AXLES, type Axle } from '@shared/season/corners';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { cn } from '@/lib/cn';
import { carFormSchema, COUNT_FROM_WORDS, type CarFormValues, type DamperCountFrom } from '../utils/car-form';

const AXLE_WORDS: Record<Axle, string> = { front: 'Front', rear: 'Rear' };
const COUNT_FROM_OPTIONS = (Object.keys(COUNT_FROM_WORDS) as DamperCountFrom[]).map((value) => ({ value, label: COUNT_FROM_WORDS[value] }));

type FormControl = Control<CarFormValues, unknown, CreateCarInput>;

function CountFrom({ control, name, label }: { control: FormControl; name: `damperAdjusters.${Axle}${'' | '.rebound'}.countFrom`; label: string }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => <SegmentedControl label={label} options={COUNT_FROM_OPTIONS} value={field.value} onChange={field.onChange} />}
    />
  );
}

interface ReboundAdjusterProps {
  control: FormControl;
  register: UseFormRegister<CarFormValues>;
  errors: FieldErrors<CarFormValues>;
  axle: Axle;
}

/** Double-adjustable dampers: a rebound adjuster of their own, with its clicks and its end, asked for once ticked. */
function ReboundAdjuster({ control, register, errors, axle }: ReboundAdjusterProps) {
  const on = useWatch({ control, name: `damperAdjusters.${axle}.rebound.on` });
  return (
    <div className="flex flex-col gap-3">
      <label className="flex min-h-tap items-center gap-3">
        <input type="checkbox" className="size-5 shrink-0 accent-accent" {...register(`damperAdjusters.${axle}.rebound.on`)} />
        <span>
          <span className="font-semibold">Separate rebound adjuster</span>
          <span className="block text-sm text-ink-muted">Double-adjustable dampers: the clicks above are then the bump adjuster’s.</span>
        </span>
      </label>
      {on ? (
        <>
          <UnitInput
            label="Number of rebound clicks"
            unit="clicks"
            inputMode="numeric"
            className="max-w-60"
            hint="Check the damper maker’s manual for the count."
            error={errors.damperAdjusters?.[axle]?.rebound?.positions?.message}
            {...register(`damperAdjusters.${axle}.rebound.positions`)}
          />
          <CountFrom control={control} name={`damperAdjusters.${axle}.rebound.countFrom`} label="Rebound click 0 is at" />
        </>
      ) : null}
    </div>
  );
}

interface CarDetailsFormProps {
  /** Names the form for screen readers: "New car", "Edit Pebble". */
  label: string;
  defaults: CarFormValues;
  submitLabel: string;
  isPending: boolean;
  /** A problem with the whole form, shown above the button. */
  formError: string | null;
  /** Saves the checked values; `setError` puts the server's field errors on their boxes. */
  onSave: (input: CreateCarInput, setError: UseFormSetError<CarFormValues>) => Promise<void>;
  /** Said under the button. */
  footnote?: ReactNode;
}

/**
 * A car's details: name, class, number, tyre size, the damper adjusters per axle (how many clicks, and which end
 * click 0 is, and the same for a separate rebound adjuster) and the motion ratios. The new-car page and the car's own edit page both use it.
 */
export function CarDetailsForm({ label, defaults, submitLabel, isPending, formError, onSave, footnote }: CarDetailsFormProps) {
  const notesId = useId();
  const { register, handleSubmit, control, formState, setError } = useForm<CarFormValues, unknown, CreateCarInput>({
    resolver: zodResolver(carFormSchema),
    defaultValues: defaults,
  });
  const errors = formState.errors;
  const onSubmit = handleSubmit((input) => onSave(input, setError));

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label={label} className="flex max-w-form flex-col gap-5">
      <TextField label="Name" hint="What you call it, e.g. “Grey roadster”." maxLength={80} error={errors.name?.message} {...register('name')} />
      <div className="grid grid-cols-1 gap-5 sm:grid-cols-2 sm:gap-3">
        <TextField label="Class" maxLength={20} autoCapitalize="characters" error={errors.classCode?.message} {...register('classCode')} />
        <TextField label="Car number (optional)" inputMode="text" maxLength={10} error={errors.carNumber?.message} {...register('carNumber')} />
      </div>
      <TextField
        label="Tyre size (optional)"
        placeholder="e.g. 205/50R15"
        maxLength={40}
        autoCapitalize="characters"
        error={errors.tyreSize?.message}
        {...register('tyreSize')}
      />

      <div className="flex flex-col gap-3">
        <div>
          <h2 className="text-lg font-bold">Damper adjusters</h2>
          <p className="text-sm text-ink-muted">
            How many clicks each adjuster has, and which end you count from. Leave the clicks empty if that axle’s dampers are not
            adjustable. Check the damper maker’s manual for the count.
          </p>
        </div>
        {AXLES.map((axle) => (
          <fieldset key={axle} className="flex min-w-0 flex-col gap-3 rounded border border-line p-3">
            <legend className="px-1 font-bold">{AXLE_WORDS[axle]} dampers</legend>
            <UnitInput
              label="Number of clicks"
              unit="clicks"
              inputMode="numeric"
              className="max-w-60"
              error={errors.damperAdjusters?.[axle]?.positions?.message}
              {...register(`damperAdjusters.${axle}.positions`)}
            />
            <CountFrom control={control} name={`damperAdjusters.${axle}.countFrom`} label="Click 0 is at" />
            <ReboundAdjuster control={control} register={register} errors={errors} axle={axle} />
          </fieldset>
        ))}
      </div>

      <fieldset className="flex min-w-0 flex-col gap-2">
        <legend className="mb-1 text-lg font-bold">Motion ratio (optional)</legend>
        <p className="text-sm text-ink-muted">Spring travel ÷ wheel travel, e.g. 0.75. Leave empty if you do not know it.</p>
        <div className="grid grid-cols-2 gap-3">
          {AXLES.map((axle) => (
            <TextField
              key={axle}
              label={`${AXLE_WORDS[axle]} motion ratio`}
              inputMode="decimal"
              autoComplete="off"
              className="tabular-figures"
              error={errors.motionRatios?.[axle]?.message}
              {...register(`motionRatios.${axle}`)}
            />
          ))}
        </div>
      </fieldset>

      <div className="flex flex-col gap-1">
        <label htmlFor={notesId} className="font-semibold">
          Notes (optional)
        </label>
        <textarea
          id={notesId}
          rows={3}
          maxLength={2000}
          aria-invalid={errors.notes ? true : undefined}
          aria-describedby={errors.notes ? `${notesId}-error` : undefined}
          className={cn(
            'min-h-tap w-full rounded border border-line-strong bg-surface px-3 py-2 text-base text-ink',
            errors.notes && 'border-2 border-warning',
          )}
          {...register('notes')}
        />
        {errors.notes ? (
          <p id={`${notesId}-error`} className="text-sm font-semibold text-warning">
            {errors.notes.message}
          </p>
        ) : null}
      </div>

      <FormAlert message={formError} />
      <Button type="submit" className="min-h-tap-lg w-full text-lg" isPending={isPending || formState.isSubmitting} pendingLabel="Saving…">
        {submitLabel}
      </Button>
      {footnote ? <p className="text-sm text-ink-muted">{footnote}</p> : null}
    </form>
  );
}
