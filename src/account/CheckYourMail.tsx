import { Notice } from '../ui/Notice';

/**
 * Sign-up under an address whose account was never confirmed: the person who reads that mailbox
 * finishes it from the mailed link (nothing changed yet).
 */
export function CheckYourMail({ email }: { email: string }) {
  return (
    <div className="mx-auto max-w-md space-y-5">
      <h1 className="text-3xl font-bold">Check your mail</h1>
      <Notice tone="info">
        An account with {email} was started before but never confirmed. We sent a link to {email}: open it to
        choose your password and finish. It works for one hour.
      </Notice>
    </div>
  );
}
