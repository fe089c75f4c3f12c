import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { FormAlert } from '@/components/ui/form-alert';
import { ResetPasswordForm } from '@/features/account/components/reset-password-form';
import type { SignInState } from '../sign-in';

const PASSWORD_CHANGED: SignInState = { notice: 'password-changed' };

/** Reached from the e-mailed link: /reset-password?token=… */
export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const token = params.get('token')?.trim() ?? '';

  return (
    <AuthLayout title="Choose a new password" intro="The link from the e-mail works once, within an hour.">
      <title>New password · Scrubline</title>
      {token ? (
        <ResetPasswordForm token={token} onDone={() => void navigate(paths.signIn, { replace: true, state: PASSWORD_CHANGED })} />
      ) : (
        <>
          <FormAlert message="This link is incomplete: open the whole link from the e-mail, or ask for a new one." />
          <Link to={paths.forgotPassword} className="inline-flex min-h-tap items-center self-start font-bold text-link underline">
            Ask for a new link
          </Link>
        </>
      )}
    </AuthLayout>
  );
}
