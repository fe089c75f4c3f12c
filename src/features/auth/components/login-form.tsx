import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type * as z from '@shared/zod';
import type { User } from '@shared/auth/auth.schema';
import { loginInputSchema, type LoginInput } from '@shared/auth/credentials.schema';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { PasswordField } from '@/components/ui/password-field';
import { EMAIL_INPUT, TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useLogin } from '../api/login';

type LoginFormValues = z.input<typeof loginInputSchema>;

const FIELDS = ['email', 'password'] as const;

export function LoginForm({ onSuccess }: { onSuccess: (user: User) => void }) {
  const login = useLogin();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<LoginFormValues, unknown, LoginInput>({
    resolver: zodResolver(loginInputSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    login.mutate(values, {
      onSuccess,
      onError: (error) => setFormError(applyServerErrors(error, setError, FIELDS)),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label="Sign in">
      <TextField
        label="E-mail"
        {...EMAIL_INPUT}
        autoComplete="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <PasswordField
        label="Password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <FormAlert message={formError} />
      <Button type="submit" isPending={login.isPending} pendingLabel="Signing in…" className="w-full">
        Sign in
      </Button>
    </form>
  );
}
