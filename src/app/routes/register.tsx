import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { NEXT_PARAM, paths, safeNextPath, signInPath } from '@/config/paths';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { RegisterForm } from '@/features/auth/components/register-form';

export function RegisterPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNextPath(params.get(NEXT_PARAM)) ?? paths.home;

  return (
    <AuthLayout title="Create your account" intro="One account for your cars, your runs and the people you share them with.">
      <title>Create account · Scrubline</title>
      <RegisterForm onSuccess={() => void navigate(next, { replace: true })} />
      <p className="text-ink-muted">
        Already have an account?{' '}
        <Link to={signInPath(next)} className="inline-flex min-h-tap items-center font-bold text-link underline">
          Sign in
        </Link>
      </p>
    </AuthLayout>
  );
}
