import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type * as z from '@shared/zod';
import type { User } from '@shared/auth/auth.schema';
import { NEW_PASSWORD_HINT, registerInputSchema, type RegisterInput } from '@shared/auth/credentials.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { PasswordStrength } from '@/components/ui/password-strength';
import { EMAIL_INPUT, TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useRegister } from '../api/register';

type RegisterFormValues = z.input<typeof registerInputSchema>;

const FIELDS = ['displayName', 'email', 'password'] as const;

export function RegisterForm({ onSuccess }: { onSuccess: (user: User) => void }) {
  const registration = useRegister();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors },
  } = useForm<RegisterFormValues, unknown, RegisterInput>({
    resolver: zodResolver(registerInputSchema),
    defaultValues: { displayName: '', email: '', password: '' },
  });

  const [password, email, displayName] = useWatch({ control, name: ['password', 'email', 'displayName'] });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    registration.mutate(values, {
      onSuccess,
      onError: (error) => setFormError(applyServerErrors(error, setError, FIELDS)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label="Create account">
      <TextField
        label="Your name"
        hint="Shown to your shop and team."
        autoComplete="name"
        autoCapitalize="words"
        error={errors.displayName?.message}
        {...register('displayName')}
      />
      <TextField
        label="E-mail"
        {...EMAIL_INPUT}
        autoComplete="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <PasswordField
        label="Password"
        hint={NEW_PASSWORD_HINT}
        autoComplete="new-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <PasswordStrength password={password} userInputs={[email, displayName]} />
      <FormAlert message={formError} />
      <Button type="submit" isPending={registration.isPending} pendingLabel="Creating account…" className="w-full">
        Create account
      </Button>
    </form>
  );
}
