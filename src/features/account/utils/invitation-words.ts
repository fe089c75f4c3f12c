import type { InvitationPreview } from '@shared/collab/invitation.schema';

/** The role an invitation offers, in words: "as staff", "as a shop admin", "as a member", "as a captain". */
export function invitedAs(preview: Pick<InvitationPreview, 'kind' | 'asAdmin'>): string {
  if (preview.kind === 'shop') return preview.asAdmin ? 'as a shop admin' : 'as staff';
  return preview.asAdmin ? 'as a captain' : 'as a member';
}

/** "Ines Okafor invites tomas@example.test to join Harrow Flats Racing as a member." */
export function invitationSentence(preview: InvitationPreview): string {
  return `${preview.invitedBy} invites ${preview.email} to join ${preview.name} ${invitedAs(preview)}.`;
}

/** Whether the signed-in address is the invited one (the server compares them lower-cased too). */
export function isInvitedAddress(preview: Pick<InvitationPreview, 'email'>, email: string): boolean {
  return preview.email.trim().toLowerCase() === email.trim().toLowerCase();
}
