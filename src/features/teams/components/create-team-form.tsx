import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Plus } from 'lucide-react';
import type * as z from '@shared/zod';
import { createTeamInputSchema, type CreateTeamInput, type TeamSummary } from '@shared/collab/team.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateTeam } from '../api/create-team';
import { onlineFailure } from '../utils/online-failure';

/** Starts a team; whoever starts it is its first captain. */
export function CreateTeamForm({ onCreated }: { onCreated: (team: TeamSummary) => void }) {
  const create = useCreateTeam();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof createTeamInputSchema>, unknown, CreateTeamInput>({
    resolver: zodResolver(createTeamInputSchema),
    defaultValues: { name: '' },
  });

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    create.mutate(input, {
      onSuccess: onCreated,
      onError: (error) => setFormError(onlineFailure(error) ?? applyServerErrors(error, setError, ['name'])),
    });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Start a team" className="flex flex-col gap-3">
      <TextField
        label="Team name"
        hint="You will be its captain: you invite members and enter the class factors."
        autoComplete="off"
        autoCapitalize="words"
        error={formState.errors.name?.message}
        {...register('name')}
      />
      <FormAlert message={formError} />
      <div>
        <Button type="submit" isPending={create.isPending} pendingLabel="Starting…">
          <Plus aria-hidden="true" className="size-5" /> Start a team
        </Button>
      </div>
    </form>
  );
}
