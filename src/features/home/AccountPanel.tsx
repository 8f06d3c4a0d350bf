import type { Me } from '../../contract/auth';
import { SignOut } from '../../account/SignOut';

/** Who is signed in, with the way out. */
export function AccountPanel({ me }: { me: Me }) {
  const { user } = me;
  return (
    <section aria-label="Account" className="surface space-y-3 rounded-xl border border-line bg-card p-4">
      <p>
        Signed in as <strong data-testid="signed-in-name">{user.displayName}</strong>
        {!user.emailVerified && (
          <span className="block text-base">▲ Confirm your e-mail address with the link we sent you.</span>
        )}
      </p>
      <SignOut userId={user.id} />
    </section>
  );
}
