import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { changePasswordInputSchema, type ChangePasswordInput } from '@shared/auth/account.schema';
import { NEW_PASSWORD_HINT } from '@shared/auth/credentials.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { PasswordStrength } from '@/components/ui/password-strength';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useChangePassword } from '../api/change-password';

const NO_CONNECTION = 'No connection: your password was not changed. Try again when you have signal.';
const CHANGED = 'Password changed. Every other device signed in to this account has been signed out; this one stays signed in.';

/** The current password typed again, then the new one (OWASP ASVS 4.0 V2.1.6). */
export function ChangePasswordForm({ email }: { email: string }) {
  const change = useChangePassword();
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const { register, handleSubmit, setError, reset, control, formState } = useForm<ChangePasswordInput>({
    resolver: zodResolver(changePasswordInputSchema),
    defaultValues: { currentPassword: '', newPassword: '' },
  });

  const newPassword = useWatch({ control, name: 'newPassword' });

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    setDone(false);
    change.mutate(input, {
      onSuccess: () => {
        reset();
        setDone(true);
      },
      onError: (error) => {
        if (isApiError(error) && error.code === 'network') setFormError(NO_CONNECTION);
        else setFormError(applyServerErrors(error, setError, ['currentPassword', 'newPassword']));
      },
    });
  });

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Change password" className="flex flex-col gap-4">
      {/* For password managers: which account the new password belongs to. */}
      <input type="text" name="username" autoComplete="username" value={email} readOnly hidden />
      <PasswordField
        label="Current password"
        autoComplete="current-password"
        error={formState.errors.currentPassword?.message}
        {...register('currentPassword', { onChange: () => setDone(false) })}
      />
      <PasswordField
        label="New password"
        hint={NEW_PASSWORD_HINT}
        autoComplete="new-password"
        error={formState.errors.newPassword?.message}
        {...register('newPassword', { onChange: () => setDone(false) })}
      />
      <PasswordStrength password={newPassword} userInputs={[email]} />
      <FormAlert message={formError} />
      {done ? (
        <p role="status" className="rounded border border-line bg-success-surface p-3 font-semibold text-success">
          {CHANGED}
        </p>
      ) : null}
      <Button type="submit" className="self-start" isPending={change.isPending} pendingLabel="Saving…">
        Change password
      </Button>
    </form>
  );
}
