import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Handshake } from 'lucide-react';
import type { AcceptedInvitation, InvitationPreview } from '@shared/collab/invitation.schema';
import { paths, registerPath, signInPath } from '@/config/paths';
import { Button, buttonClasses } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { isApiError } from '@/lib/api-client';
import { formatDay } from '@/lib/dates';
import { useAcceptInvitation } from '../api/accept-invitation';
import { invitationSentence, isInvitedAddress } from '../utils/invitation-words';

const NEEDS_SIGNAL = 'No connection: you have not joined yet. Try again when you have signal.';

function acceptFailure(error: unknown): string {
  if (isApiError(error) && error.code === 'network') return NEEDS_SIGNAL;
  if (isApiError(error) && error.message) return error.message;
  return 'Something went wrong; you have not joined yet. Try again.';
}

interface InvitationViewProps {
  token: string;
  preview: InvitationPreview;
  /** The signed-in user's e-mail, or null when nobody is signed in. */
  signedInAs: string | null;
  /** This page's address, to come back to after signing in or registering. */
  here: string;
  onAccepted: (accepted: AcceptedInvitation) => void;
}

/** What the invitation offers, and the one next step: sign in (or register) first, or join. */
export function InvitationView({ token, preview, signedInAs, here, onAccepted }: InvitationViewProps) {
  const accept = useAcceptInvitation(token);
  const [error, setError] = useState<string | null>(null);

  const sentence = <p className="text-lg font-semibold text-ink">{invitationSentence(preview)}</p>;

  if (preview.state === 'used') {
    return (
      <div className="flex flex-col gap-3">
        {sentence}
        <FormAlert message="This invitation has already been used. If it was you, you are in already; otherwise ask for a new invitation." />
      </div>
    );
  }
  if (preview.state === 'expired') {
    return (
      <div className="flex flex-col gap-3">
        {sentence}
        <FormAlert message={`This invitation expired on ${formatDay(preview.expiresAt)}. Invitations work for a week; ask ${preview.invitedBy} for a new one.`} />
      </div>
    );
  }

  if (signedInAs === null) {
    return (
      <div className="flex flex-col gap-4">
        {sentence}
        <p className="text-ink-muted">
          Sign in as {preview.email} to accept, or create an account with that address. You come back here afterwards.
        </p>
        <div className="flex flex-col gap-3">
          <Link to={signInPath(here)} className={buttonClasses('primary', 'w-full')}>
            Sign in to accept
          </Link>
          <Link to={registerPath(here)} className={buttonClasses('secondary', 'w-full')}>
            Create an account
          </Link>
        </div>
      </div>
    );
  }

  if (!isInvitedAddress(preview, signedInAs)) {
    return (
      <div className="flex flex-col gap-3">
        {sentence}
        <FormAlert
          message={`You are signed in as ${signedInAs}, but this invitation is for ${preview.email}. Sign out (in the account menu), sign in as ${preview.email} and open this link again — or ask for an invitation to ${signedInAs}.`}
        />
        <Link to={paths.home} className={buttonClasses('secondary', 'self-start')}>
          Go to Scrubline
        </Link>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-4">
      {sentence}
      <p className="text-ink-muted">The invitation works until {formatDay(preview.expiresAt)}, once.</p>
      <FormAlert message={error} />
      <Button
        className="w-full"
        isPending={accept.isPending}
        pendingLabel="Joining…"
        onClick={() => {
          setError(null);
          accept.mutate(undefined, { onSuccess: onAccepted, onError: (e) => setError(acceptFailure(e)) });
        }}
      >
        <Handshake aria-hidden="true" className="size-5" /> Join {preview.name}
      </Button>
    </div>
  );
}
