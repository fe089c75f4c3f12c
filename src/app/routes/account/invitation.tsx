import { Link, useLocation, useNavigate, useParams } from 'react-router-dom';
import type { AcceptedInvitation } from '@shared/collab/invitation.schema';
import { paths } from '@/config/paths';
import { recordPath } from '@/config/record-paths';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { FormAlert } from '@/components/ui/form-alert';
import { isApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useInvitation } from '@/features/account/api/get-invitation';
import { InvitationView } from '@/features/account/components/invitation-view';

/** Where a new member lands: their shop's page, or the team's. */
const destination = (accepted: AcceptedInvitation) => (accepted.kind === 'shop' ? paths.shop : recordPath.team(accepted.id));

/** An invitation link: works signed in or out (signed out, it offers sign-in or registration first). */
export function InvitationPage() {
  const { token = '' } = useParams();
  const location = useLocation();
  const navigate = useNavigate();
  const me = useMe();
  const invitation = useInvitation(token);

  let body;
  if (invitation.isPending || me.isPending) {
    body = <p className="text-ink-muted">Opening the invitation…</p>;
  } else if (!invitation.data) {
    const error = invitation.error;
    body = (
      <>
        <FormAlert
          message={
            isApiError(error) && error.status === 404
              ? 'This invitation link does not work. Check that you opened the whole link from the e-mail, or ask for a new invitation.'
              : isApiError(error)
                ? error.message
                : 'The invitation could not be opened. Try again shortly.'
          }
        />
        <Link to={paths.home} className="inline-flex min-h-tap items-center self-start font-bold text-link underline">
          Go to Scrubline
        </Link>
      </>
    );
  } else {
    body = (
      <InvitationView
        token={token}
        preview={invitation.data}
        signedInAs={me.data?.email ?? null}
        here={location.pathname}
        onAccepted={(accepted) => void navigate(destination(accepted), { replace: true })}
      />
    );
  }

  return (
    <AuthLayout title="An invitation">
      <title>Invitation · Scrubline</title>
      {body}
    </AuthLayout>
  );
}
