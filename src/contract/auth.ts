import { z } from 'zod';
import { nameText } from './names';

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That does not look like an e-mail address.' }));

/** Length only here; the server also refuses the most common passwords. */
export const newPasswordSchema = z
  .string({ error: 'Enter a password.' })
  .min(8, 'Use at least 8 characters for your password.')
  .max(200, 'Use at most 200 characters for your password.');

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

export const eventRoleSchema = z.enum(['organizer', 'judge', 'archer']);
export type EventRole = z.infer<typeof eventRoleSchema>;

export type SessionUser = { id: number; email: string; displayName: string; emailVerified: boolean };

/** What sign-in, sign-up and refresh return: a short-lived access token and who it is for. */
export type AuthSession = { accessToken: string; expiresAt: string; user: SessionUser };

export type Me = {
  user: SessionUser;
  roles: { eventId: number; eventName: string; role: EventRole }[];
};
