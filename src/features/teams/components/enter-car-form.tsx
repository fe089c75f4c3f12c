import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { Plus } from 'lucide-react';
import type * as z from '@shared/zod';
import { enterCarInputSchema, type EnterCarInput } from '@shared/collab/team.schema';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useEnterCar } from '../api/enter-car';
import { onlineFailure } from '../utils/online-failure';
import { SharingChoice } from './sharing-choice';

/** A car the user may enter: one they own (co-driven cars are their owners' to enter). */
export interface OwnCar {
  id: string;
  name: string;
  carNumber: string | null;
  classCode: string;
}

const carLabel = (car: OwnCar) => `${car.name}${car.carNumber ? ` #${car.carNumber}` : ''} · class ${car.classCode}`;

/** Enters one of the user's own cars: which car, in which class, and what the team may see. */
export function EnterCarForm({ teamId, cars }: { teamId: string; cars: readonly OwnCar[] }) {
  const enter = useEnterCar(teamId);
  const [formError, setFormError] = useState<string | null>(null);
  const [entered, setEntered] = useState<string | null>(null);
  const first = cars[0];
  const { register, control, handleSubmit, setError, setValue, reset, formState } = useForm<
    z.input<typeof enterCarInputSchema>,
    unknown,
    EnterCarInput
  >({
    resolver: zodResolver(enterCarInputSchema),
    defaultValues: { carId: first?.id ?? '', classCode: first?.classCode ?? '', sharing: 'results' },
  });

  if (!first) {
    return (
      <EmptyState message="No car of yours is left to enter. Only a car’s owner enters it; add your own car on the Cars page.">
        <Link to={paths.cars} className="inline-flex min-h-tap items-center self-start font-bold text-link underline">
          Open Cars
        </Link>
      </EmptyState>
    );
  }

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    setEntered(null);
    const car = cars.find((c) => c.id === input.carId);
    enter.mutate(input, {
      onSuccess: () => {
        setEntered(`${car?.name ?? 'The car'} is entered in class ${input.classCode}.`);
        const next = cars.find((c) => c.id !== input.carId);
        reset({ carId: next?.id ?? '', classCode: next?.classCode ?? '', sharing: 'results' });
      },
      onError: (error) => setFormError(onlineFailure(error) ?? applyServerErrors(error, setError, ['carId', 'classCode', 'sharing'])),
    });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Enter a car" className="flex flex-col gap-4">
      <SelectField
        label="Your car"
        options={cars.map((car) => ({ value: car.id, label: carLabel(car) }))}
        error={formState.errors.carId?.message}
        {...register('carId', {
          onChange: (event: { target: { value: string } }) => {
            const car = cars.find((c) => c.id === event.target.value);
            if (car) setValue('classCode', car.classCode, { shouldValidate: false });
            setEntered(null);
          },
        })}
      />
      <TextField
        label="Class"
        hint="The class this car runs in on the team’s board; it starts as the car’s own class."
        autoComplete="off"
        autoCapitalize="characters"
        error={formState.errors.classCode?.message}
        {...register('classCode')}
      />
      <Controller
        control={control}
        name="sharing"
        render={({ field, fieldState }) => (
          <SharingChoice name="enter-sharing" value={field.value ?? 'results'} onChange={field.onChange} error={fieldState.error?.message} />
        )}
      />
      <FormAlert message={formError} />
      <p role="status" className="text-sm font-semibold text-success">
        {entered}
      </p>
      <div>
        <Button type="submit" isPending={enter.isPending} pendingLabel="Entering…">
          <Plus aria-hidden="true" className="size-5" /> Enter the car
        </Button>
      </div>
    </form>
  );
}
