import * as z from '../zod';
import { newPasswordSchema } from '../auth/credentials.schema';
import { emailSchema } from '../auth/auth.schema';

/** What an invitation link shows before it is accepted. */
export interface InvitationPreview {
  kind: 'shop' | 'team';
  name: string;
  email: string;
  asAdmin: boolean;
  invitedBy: string;
  expiresAt: string;
  state: 'open' | 'used' | 'expired';
}

export interface AcceptedInvitation {
  kind: 'shop' | 'team';
  id: string;
  name: string;
}

export const passwordResetRequestSchema = z.strictObject({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetConfirmSchema = z.strictObject({
  token: z.string({ error: 'The reset link is incomplete' }).check(z.minLength(20, 'The reset link is incomplete'), z.maxLength(200)),
  password: newPasswordSchema,
});
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirmSchema>;

/** Invitations last a week and reset links an hour; each works once. */
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;
export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

/** The answer to a reset request: the same whether or not an account uses the address. */
export interface PasswordResetRequested {
  message: string;
}
export const PASSWORD_RESET_REQUESTED_MESSAGE =
  'If an account uses that address, we have sent it a link to choose a new password. The link works once, within one hour.';
