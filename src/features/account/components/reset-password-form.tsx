import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import * as z from '@shared/zod';
import { NEW_PASSWORD_HINT, newPasswordSchema } from '@shared/auth/credentials.schema';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { PasswordStrength } from '@/components/ui/password-strength';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';

const formSchema = z.strictObject({ password: newPasswordSchema });
type FormValues = z.infer<typeof formSchema>;

const NO_CONNECTION = 'No connection: your password was not changed. Try again when you have signal.';

/** The link no longer works: say so, and offer a new one. */
function LinkProblem({ message }: { message: string }) {
  return (
    <div role="alert" className="flex flex-col gap-2 rounded border border-warning-line bg-warning-surface p-3">
      <p className="font-semibold text-warning">{message}</p>
      <Link to={paths.forgotPassword} className="inline-flex min-h-tap items-center self-start font-bold text-link underline">
        Ask for a new link
      </Link>
    </div>
  );
}

/** Chooses a new password with the e-mailed link's token. */
export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const confirm = useConfirmPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const [tokenError, setTokenError] = useState<string | null>(null);
  const { register, handleSubmit, setError, control, formState } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { password: '' },
  });

  const password = useWatch({ control, name: 'password' });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setTokenError(null);
    confirm.mutate(
      { token, password: values.password },
      {
        onSuccess: onDone,
        onError: (error) => {
          if (isApiError(error) && error.code === 'network') {
            setFormError(NO_CONNECTION);
            return;
          }
          const tokenMessages = isApiError(error) ? error.fieldErrors.token : undefined;
          if (tokenMessages) {
            // Expired or used: the link itself is the problem, whatever was typed.
            setTokenError(tokenMessages.join(' '));
            return;
          }
          setFormError(applyServerErrors(error, setError, ['password']));
        },
      },
    );
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Choose a new password" className="flex flex-col gap-5">
      {tokenError ? <LinkProblem message={tokenError} /> : null}
      <PasswordField
        label="New password"
        hint={NEW_PASSWORD_HINT}
        autoComplete="new-password"
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <PasswordStrength password={password} />
      <FormAlert message={formError} />
      <Button type="submit" className="w-full" isPending={confirm.isPending} pendingLabel="Saving…">
        Save the new password
      </Button>
    </form>
  );
}
