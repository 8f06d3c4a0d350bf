import { Link } from 'react-router-dom';
import { useMe } from '../auth/api/me';
import { useSignOut } from '../auth/api/signIn';
import { Button } from '../../ui/Button';

const linkClass = 'flex min-h-14 items-center justify-center rounded-lg px-5 text-lg font-bold';

/** Who is signed in, their events, and the way in for someone who is not. */
export function AccountPanel() {
  const me = useMe();
  const signOut = useSignOut();
  if (me.isPending) return null;
  if (!me.data) {
    return (
      <section aria-label="Account" className="grid grid-cols-2 gap-3">
        <Link to="/sign-in" className={`${linkClass} bg-moss text-white`}>
          Sign in
        </Link>
        <Link to="/sign-up" className={`${linkClass} border-2 border-ink`}>
          Create account
        </Link>
      </section>
    );
  }
  const { user, roles } = me.data;
  return (
    <section aria-label="Account" className="surface space-y-3 rounded-xl border border-line bg-card p-4">
      <p>
        Signed in as <strong data-testid="signed-in-name">{user.displayName}</strong>
        {!user.emailVerified && (
          <span className="block text-base">▲ Confirm your e-mail address with the link we sent you.</span>
        )}
      </p>
      {roles.length > 0 && (
        <ul className="space-y-1">
          {roles.map((r) => (
            <li key={`${r.eventId}-${r.role}`}>
              <Link
                to={
                  r.role === 'judge'
                    ? `/desk/${r.eventId}`
                    : r.role === 'archer'
                      ? '/cards'
                      : `/events/${r.eventId}`
                }
                className="font-bold underline"
              >
                {r.eventName}
              </Link>{' '}
              <span className="text-base">
                · {r.role === 'judge' ? 'judge desk' : r.role === 'archer' ? 'your scorecard' : r.role}
              </span>
            </li>
          ))}
        </ul>
      )}
      <div className="flex flex-wrap gap-3">
        <Link to="/events" className={`${linkClass} bg-moss text-white`}>
          My events
        </Link>
        <Button variant="secondary" onClick={() => signOut.mutate()} disabled={signOut.isPending}>
          Sign out
        </Button>
      </div>
    </section>
  );
}
