import { Link } from 'react-router-dom';
import { SafetyNote } from '../../ui/SafetyNote';
import { useOnline } from '../../local/online';
import { useServerHealth } from './api/serverHealth';
import { PersonHome } from './PersonHome';
import { useMe } from '../../local/me';

const STEPS = [
  {
    title: 'Join your target',
    text: 'Use the join code printed on your target sheet. Your phone keeps the card even with no signal.',
  },
  {
    title: 'Two writers, one call',
    text: 'The caller calls each arrow, highest first. Two writers enter it on their own phones.',
  },
  {
    title: 'Cross-check, then pull',
    text: 'Ringcall compares both entries arrow by arrow. Settle any difference before arrows are pulled.',
  },
  {
    title: 'Signed and ranked',
    text: 'When signal returns, ends reach the judges to sign, and signed cards feed the standings.',
  },
];

function ServerLine() {
  const online = useOnline();
  const health = useServerHealth();
  if (health.data) {
    const checked = new Date(health.dataUpdatedAt).toLocaleTimeString([], {
      hour: '2-digit',
      minute: '2-digit',
    });
    return (
      <p data-testid="server-line">
        <span aria-hidden="true">{online ? '✓ ' : '▲ '}</span>
        {online
          ? `Event server reached at ${checked}`
          : `No signal. Last reached the event server at ${checked}`}{' '}
        · version {health.data.version}
      </p>
    );
  }
  if (health.isPending) return <p data-testid="server-line">Looking for the event server…</p>;
  return (
    <p data-testid="server-line">
      <span aria-hidden="true">▲ </span>
      {online
        ? 'The event server is not answering. Scoring on this phone still works.'
        : 'No signal. Scoring on this phone still works.'}
    </p>
  );
}

const linkClass = 'flex min-h-14 items-center justify-center rounded-lg px-5 text-lg font-bold';

/** What Ringcall is and how a day with it goes, with the way in. */
function Welcome({ known }: { known: boolean }) {
  return (
    <>
      <section className="space-y-2">
        <h1 className="text-3xl font-bold leading-tight">
          Your scorecard, on the field, with or without signal
        </h1>
        <p className="text-lg">
          Ringcall keeps every called arrow on this phone first, then brings it to the event when it can.
        </p>
      </section>
      {known && (
        <section aria-label="Account" className="grid grid-cols-2 gap-3">
          <Link to="/sign-in" className={`${linkClass} bg-moss text-white`}>
            Sign in
          </Link>
          <Link to="/sign-up" className={`${linkClass} border-2 border-ink`}>
            Create account
          </Link>
        </section>
      )}
      <ol className="space-y-3">
        {STEPS.map((step, i) => (
          <li key={step.title} className="surface flex gap-4 rounded-xl border border-line bg-card p-4">
            <span
              aria-hidden="true"
              className="flex h-11 w-11 shrink-0 items-center justify-center rounded-full bg-ink text-xl font-bold text-white"
            >
              {i + 1}
            </span>
            <div>
              <h2 className="text-xl font-bold">{step.title}</h2>
              <p>{step.text}</p>
            </div>
          </li>
        ))}
      </ol>
    </>
  );
}

/** For everyone, signed in or not: the practice log needs no account. */
function PracticeLink() {
  return (
    <section aria-label="Practice" className="surface rounded-xl border border-line bg-card p-4">
      <Link to="/practice" className="flex min-h-14 flex-col justify-center" data-testid="practice-link">
        <span className="text-xl font-bold underline">Practice log</span>
        <span>Score alone, plot each arrow, see your group. Kept on this phone, no account needed.</span>
      </Link>
    </section>
  );
}

export function HomeScreen() {
  const me = useMe();
  return (
    <div className="space-y-6">
      {me.data ? <PersonHome me={me.data} /> : <Welcome known={!me.isPending} />}
      <PracticeLink />
      <SafetyNote />
      <footer className="text-base text-ink-soft">
        <ServerLine />
      </footer>
    </div>
  );
}
