import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { NEXT_PARAM, paths, registerPath, safeNextPath } from '@/config/paths';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { LoginForm } from '@/features/auth/components/login-form';

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNextPath(params.get(NEXT_PARAM)) ?? paths.home;

  return (
    <AuthLayout title="Sign in" intro="Your season notebook: runs, setups and notes from every event.">
      <title>Sign in · Scrubline</title>
      <LoginForm onSuccess={() => void navigate(next, { replace: true })} />
      <p className="text-ink-muted">
        New to Scrubline?{' '}
        <Link to={registerPath(next)} className="inline-flex min-h-tap items-center font-bold text-link underline">
          Create an account
        </Link>
      </p>
    </AuthLayout>
  );
}
