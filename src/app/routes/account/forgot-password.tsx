import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { ForgotPasswordForm } from '@/features/account/components/forgot-password-form';

export function ForgotPasswordPage() {
  return (
    <AuthLayout title="Forgot your password?" intro="We e-mail you a link to choose a new one.">
      <title>Forgot password · Scrubline</title>
      <ForgotPasswordForm />
      <p className="text-ink-muted">
        Remembered it?{' '}
        <Link to={paths.signIn} className="inline-flex min-h-tap items-center font-bold text-link underline">
          Sign in
        </Link>
      </p>
    </AuthLayout>
  );
}
