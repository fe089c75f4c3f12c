import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { MailCheck } from 'lucide-react';
import type * as z from '@shared/zod';
import {
  PASSWORD_RESET_REQUESTED_MESSAGE,
  passwordResetRequestSchema,
  type PasswordResetRequest,
} from '@shared/collab/invitation.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { EMAIL_INPUT, TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

const NO_CONNECTION = 'No connection: nothing was sent. Try again when you have signal.';

/**
 * Asks for a link to choose a new password. Whatever the server found, the page says the same
 * thing, so nobody can use it to learn which addresses have accounts.
 */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [sent, setSent] = useState(false);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<z.input<typeof passwordResetRequestSchema>, unknown, PasswordResetRequest>({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: '' },
  });

  if (sent) {
    return (
      <div role="status" className="flex items-start gap-3 rounded border border-line bg-success-surface p-4 text-ink">
        <MailCheck aria-hidden="true" className="mt-0.5 size-6 shrink-0 text-success" />
        <p className="font-semibold">{PASSWORD_RESET_REQUESTED_MESSAGE}</p>
      </div>
    );
  }

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    request.mutate(input, {
      onSuccess: () => setSent(true),
      onError: (error) => {
        if (isApiError(error) && error.code === 'network') setFormError(NO_CONNECTION);
        else setFormError(applyServerErrors(error, setError, ['email']));
      },
    });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Ask for a reset link" className="flex flex-col gap-5">
      <TextField
        label="E-mail"
        hint="The address you sign in with."
        {...EMAIL_INPUT}
        autoComplete="email"
        error={formState.errors.email?.message}
        {...register('email')}
      />
      <FormAlert message={formError} />
      <Button type="submit" className="w-full" isPending={request.isPending} pendingLabel="Sending…">
        Send me a link
      </Button>
    </form>
  );
}
