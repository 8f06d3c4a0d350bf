import { z } from 'zod';
import { nameText } from './names';

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That does not look like an e-mail address.' }));

/** bcrypt, which keeps passwords, reads only the first 72 bytes; longer passwords are refused. */
export const PASSWORD_MAX_BYTES = 72;

const utf8Bytes = (text: string): number => new TextEncoder().encode(text).length;

/** Shape only here; the server also refuses the most common passwords and the account's own address. */
export const newPasswordSchema = z
  .string({ error: 'Enter a password.' })
  .min(8, 'Use at least 8 characters for your password.')
  .refine((p) => utf8Bytes(p) <= PASSWORD_MAX_BYTES, {
    error:
      'Use at most 72 bytes for your password (about 72 letters without accents, fewer with accents or other scripts): only that much is checked.',
  })
  .refine((p) => new Set(p).size > 1, {
    error: 'A password of one repeated character is easy to guess. Choose another.',
  });

export const signUpSchema = z.object({
  email: emailSchema,
  password: newPasswordSchema,
  displayName: nameText('your name', 120, 'Enter your name as it should appear on scorecards.'),
  /** Present when the person follows an invitation link. */
  inviteToken: z.string().max(200).optional(),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

const linkToken = z
  .string({ error: 'The link is missing its code.' })
  .min(10, 'The link is incomplete.')
  .max(200);
export const verifyEmailSchema = z.object({ token: linkToken });
export const acceptInvitationSchema = z.object({ token: linkToken });

export const forgotPasswordSchema = z.object({ email: emailSchema });
export type ForgotPasswordInput = z.infer<typeof forgotPasswordSchema>;

export const resetPasswordSchema = z.object({ token: linkToken, password: newPasswordSchema });
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

export const eventRoleSchema = z.enum(['organizer', 'judge', 'archer']);
export type EventRole = z.infer<typeof eventRoleSchema>;

export type SessionUser = { id: number; email: string; displayName: string; emailVerified: boolean };

/** What sign-in, sign-up and refresh return: a short-lived access token and who it is for. */
export type AuthSession = { accessToken: string; expiresAt: string; user: SessionUser };

/**
 * Sign-up under an address whose account was never confirmed: nothing changes until the link
 * mailed to the address is opened (202), so only the mailbox's owner can take the account over.
 */
export type SignUpPending = { confirmByMail: true; email: string };

/** An invitation taken up: the role, and the event it is in. */
export type AcceptedInvitation = { eventId: number; eventName: string; role: EventRole };

export type Me = {
  user: SessionUser;
  roles: { eventId: number; eventName: string; role: EventRole }[];
};
