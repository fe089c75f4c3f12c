import { useParams } from 'react-router-dom';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { UnsubscribePanel } from '@/features/account/components/unsubscribe-panel';

/** Reached from the link at the foot of every notification e-mail; no sign-in needed. */
export function UnsubscribePage() {
  const { token = '' } = useParams();
  return (
    <AuthLayout title="Notification e-mails">
      <title>Stop e-mails · Scrubline</title>
      <UnsubscribePanel token={token} />
    </AuthLayout>
  );
}
