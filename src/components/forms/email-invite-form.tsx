import { useState, type ReactNode } from 'react';
import { useForm, type Control, type Path, type UseFormRegister } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { LucideIcon } from 'lucide-react';
import type * as z from '@shared/zod';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { EMAIL_INPUT, TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';

// Not in components/ui: the build bundles ui/ into one file the trackside page loads, and this one brings react-hook-form with it.

/** What the form holds: someone's e-mail and, for an invitation, whether they join as an admin. */
export interface EmailFormValues {
  email: string;
  asAdmin?: boolean;
}

interface EmailInviteFormProps<TInput extends { email: string }, TResult> {
  /** The form's accessible name. */
  label: string;
  emailLabel: string;
  emailHint: string;
  schema: z.ZodMiniType<TInput, EmailFormValues>;
  /** The empty form; its keys are the fields server errors may land on. */
  defaultValues: EmailFormValues;
  /** An online write (errors shown here, on the form). */
  mutation: {
    mutate: (input: TInput, handlers: { onSuccess: (result: TResult) => void; onError: (error: unknown) => void }) => void;
    isPending: boolean;
  };
  /** Said (as a status) once the server has it; the form empties. */
  doneText: (input: TInput, result: TResult) => string;
  /** Said when there is no connection. */
  offlineText: string;
  submitLabel: string;
  submitIcon: LucideIcon;
  pendingLabel: string;
  /** Anything between the e-mail and the messages: more fields, a note. */
  children?: (form: { register: UseFormRegister<EmailFormValues>; control: Control<EmailFormValues, unknown, TInput> }) => ReactNode;
}

/**
 * Asks for one person's e-mail (to invite them, or to add their account) and sends it at once:
 * the server's field errors land on the fields, no connection or anything else shows above the button.
 */
export function EmailInviteForm<TInput extends { email: string }, TResult>({
  label,
  emailLabel,
  emailHint,
  schema,
  defaultValues,
  mutation,
  doneText,
  offlineText,
  submitLabel,
  submitIcon: SubmitIcon,
  pendingLabel,
  children,
}: EmailInviteFormProps<TInput, TResult>) {
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, reset, formState } = useForm<EmailFormValues, unknown, TInput>({
    resolver: zodResolver(schema),
    defaultValues,
  });
  const fields = Object.keys(defaultValues) as Path<EmailFormValues>[];

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    setDone(null);
    mutation.mutate(input, {
      onSuccess: (result) => {
        setDone(doneText(input, result));
        reset(defaultValues);
      },
      onError: (error) =>
        setFormError(isApiError(error) && error.code === 'network' ? offlineText : applyServerErrors(error, setError, fields)),
    });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label={label} className="flex flex-col gap-3">
      <TextField
        label={emailLabel}
        hint={emailHint}
        {...EMAIL_INPUT}
        autoComplete="off"
        error={formState.errors.email?.message}
        {...register('email', { onChange: () => setDone(null) })}
      />
      {children?.({ register, control })}
      <FormAlert message={formError} />
      <p role="status" className="text-sm font-semibold text-success">
        {done}
      </p>
      <div>
        <Button type="submit" variant="secondary" isPending={mutation.isPending} pendingLabel={pendingLabel}>
          <SubmitIcon aria-hidden="true" className="size-5" /> {submitLabel}
        </Button>
      </div>
    </form>
  );
}
