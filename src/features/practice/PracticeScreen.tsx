import { useEffect, useMemo, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { BOW_STYLES, ROUND_CATALOG, roundArrowCount } from '../../core';
import { practiceTally } from '../../core/practice';
import { partsTally } from '../../core/practice/progressParts';
import { SHAFT_DIAMETER_MM, readShaftDiameter } from '../../core/shaft';
import { PRACTICE_NOTE_MAX } from '../../core/practice/limits';
import type { BowStyle, FaceId, Venue } from '../../core';
import { usePhoneOwner } from '../../local/phoneOwner';
import { localDb } from '../../local/db';
import { refusedPractice } from '../../local/practiceSync';
import { saveFile } from '../../api/downloadFile';
import { Button } from '../../ui/Button';
import { Field } from '../../ui/Field';
import { SelectField } from '../../ui/SelectField';
import { FaceSelect } from '../../ui/FaceSelect';
import { Notice } from '../../ui/Notice';
import { SafetyNote } from '../../ui/SafetyNote';
import { BOW_STYLE_LABELS, sessionTitle } from './plan';
import { useStored } from './useStored';
import { practiceCsv } from './practiceCsv';
import { warmProgressView } from './progress/loadProgress';
import {
  deletePracticeSession,
  ownPractice,
  restorePracticeSession,
  startPracticeSession,
  type DeletedPractice,
  type NewPracticeSession,
} from './practiceStore';
import { useOwnSessionParts, useStoredTournamentCards } from './storedPractice';
import { tournamentTitle, useFreshTournamentCards } from './tournamentCards';

const BOW_KEY = 'ringcall.practiceBowStyle';
const SHAFT_KEY = 'ringcall.practiceShaftMm';
const INDOOR_FACES: ReadonlySet<FaceId> = new Set(['full-40', 'triple-40', 'full-60']);

function savedBowStyle(): BowStyle {
  try {
    const saved = localStorage.getItem(BOW_KEY);
    return BOW_STYLES.find((b) => b === saved) ?? 'recurve';
  } catch {
    return 'recurve';
  }
}

/** The last shaft diameter used on this phone (an archer shoots the same arrows for weeks). */
function savedShaft(): string {
  try {
    const saved = readShaftDiameter(localStorage.getItem(SHAFT_KEY) ?? '');
    return String(saved.ok ? saved.mm : SHAFT_DIAMETER_MM.default);
  } catch {
    return String(SHAFT_DIAMETER_MM.default);
  }
}

/** The practice log: start a session in two taps, and the sessions kept on this phone. */
export function PracticeScreen() {
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-3xl font-bold leading-tight">Practice log</h1>
        <p>
          Score alone at the club or at home. No account or signal needed; signed in, your log also goes to
          your account, with your tournament cards beside it.
        </p>
      </header>
      <StartPractice />
      <PastSessions />
      <SafetyNote compact />
    </div>
  );
}

function StartPractice() {
  const navigate = useNavigate();
  const [bowStyle, setBowStyle] = useState<BowStyle>(savedBowStyle);
  const [note, setNote] = useState('');
  const [shaft, setShaft] = useState(savedShaft);
  const shaftReading = readShaftDiameter(shaft);
  const [free, setFree] = useState({
    distanceM: '18',
    faceId: 'full-40' as FaceId,
    arrowsPerEnd: '3',
    ends: '10',
  });
  const [error, setError] = useState<string>();

  const chooseBow = (b: BowStyle) => {
    setBowStyle(b);
    try {
      localStorage.setItem(BOW_KEY, b);
    } catch {
      // Private mode: remembered for this visit only.
    }
  };
  const start = (session: Omit<NewPracticeSession, 'bowStyle' | 'note' | 'shaftDiameterMm'>) => {
    if (!shaftReading.ok) return setError(shaftReading.message);
    const trimmed = note.trim().slice(0, PRACTICE_NOTE_MAX);
    try {
      localStorage.setItem(SHAFT_KEY, String(shaftReading.mm));
    } catch {
      // Private mode: the default again next visit.
    }
    startPracticeSession({
      ...session,
      bowStyle,
      shaftDiameterMm: shaftReading.mm,
      ...(trimmed ? { note: trimmed } : {}),
    }).then(
      (id) => navigate(`/practice/${id}`),
      () => setError('This phone could not store the session. Free some space and try again.'),
    );
  };
  const startFree = () => {
    const distanceM = Number(free.distanceM);
    const arrowsPerEnd = Number(free.arrowsPerEnd);
    const ends = free.ends.trim() === '' ? null : Number(free.ends);
    if (!Number.isFinite(distanceM) || distanceM < 1 || distanceM > 150)
      return setError('Give a distance from 1 to 150 m.');
    if (ends !== null && (!Number.isInteger(ends) || ends < 1 || ends > 100))
      return setError('Give a number of ends from 1 to 100, or leave it empty for open-ended.');
    const venue: Venue = INDOOR_FACES.has(free.faceId) ? 'indoor' : 'outdoor';
    start({ distanceM, faceId: free.faceId, arrowsPerEnd, plannedEnds: ends, venue });
  };
  const rounds = ROUND_CATALOG.filter((r) => r.bowStyles.includes(bowStyle));

  return (
    <section
      aria-labelledby="start-practice"
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
    >
      <h2 id="start-practice" className="text-2xl font-bold">
        Start practice
      </h2>
      <div role="group" aria-label="Bow style" className="grid grid-cols-3 gap-2">
        {BOW_STYLES.map((b) => (
          // Three to a line on a phone: the shared Button's larger type would not fit "Compound".
          <button
            key={b}
            type="button"
            aria-pressed={b === bowStyle}
            onClick={() => chooseBow(b)}
            className={`min-h-14 rounded-lg border-2 px-1 text-base font-bold transition-transform active:scale-[0.97] ${
              b === bowStyle ? 'border-moss bg-moss text-white' : 'border-ink bg-card text-ink'
            }`}
          >
            {BOW_STYLE_LABELS[b]}
          </button>
        ))}
      </div>
      <Field
        label="Note (optional)"
        hint="Place, weather, equipment, sight mark"
        value={note}
        maxLength={PRACTICE_NOTE_MAX}
        onChange={(e) => setNote(e.target.value)}
      />
      <Field
        label="Arrow shaft diameter (mm)"
        hint={`For plotting: a shaft touching a line scores the higher zone. ${SHAFT_DIAMETER_MM.min} to ${SHAFT_DIAMETER_MM.max} mm.`}
        inputMode="decimal"
        value={shaft}
        error={shaftReading.ok ? undefined : shaftReading.message}
        onChange={(e) => setShaft(e.target.value)}
      />
      <h3 className="text-xl font-bold">A round</h3>
      <ul className="space-y-2">
        {rounds.map((round) => {
          const first = round.distances[0];
          return (
            <li key={round.id}>
              <Button
                variant="secondary"
                className="w-full text-left"
                onClick={() =>
                  start({
                    roundId: round.id,
                    venue: round.venue,
                    distanceM: first?.distanceM ?? 0,
                    faceId: first?.faceId ?? 'full-122',
                    arrowsPerEnd: first?.arrowsPerEnd ?? 6,
                    plannedEnds: null,
                  })
                }
              >
                {round.name} <span className="font-normal">· {roundArrowCount(round)} arrows</span>
              </Button>
            </li>
          );
        })}
      </ul>
      <h3 className="text-xl font-bold">Free practice</h3>
      <div className="grid grid-cols-2 gap-3">
        <Field
          label="Distance (m)"
          inputMode="numeric"
          value={free.distanceM}
          onChange={(e) => setFree({ ...free, distanceM: e.target.value })}
        />
        <SelectField
          label="Arrows per end"
          value={free.arrowsPerEnd}
          onChange={(e) => setFree({ ...free, arrowsPerEnd: e.target.value })}
        >
          {[1, 2, 3, 4, 5, 6].map((n) => (
            <option key={n}>{n}</option>
          ))}
        </SelectField>
        <FaceSelect value={free.faceId} onChange={(faceId) => setFree({ ...free, faceId })} />
        <Field
          label="Ends"
          hint="Empty: open-ended"
          inputMode="numeric"
          value={free.ends}
          onChange={(e) => setFree({ ...free, ends: e.target.value })}
        />
      </div>
      <Button className="w-full" onClick={startFree}>
        Start free practice
      </Button>
      {error && <Notice tone="error">{error}</Notice>}
    </section>
  );
}

/** Lines of the log drawn at first, newest first. */
const LOG_FIRST_LINES = 20;

function PastSessions() {
  const [deleted, setDeleted] = useState<DeletedPractice>();
  const [whole, setWhole] = useState(false);
  const owner = usePhoneOwner();
  // Each session's line from its progress parts: a year of practice is 300 rows, not 20,000 arrows.
  // The reads progress shares (its screen opens from them at once).
  const own = useOwnSessionParts(owner);
  const sessions = useMemo(
    () => own?.map(({ session, parts }) => ({ session, tally: partsTally(parts) })),
    [own],
  );
  // The person's own tournament cards, in the same history: read-only, kept for offline.
  const storedCards = useStoredTournamentCards(owner);
  const cards = useMemo(
    () => storedCards?.map((card) => ({ card, tally: practiceTally(card.ends.flatMap((e) => e.values)) })),
    [storedCards],
  );
  useEffect(() => (own && storedCards ? warmProgressView(own, storedCards) : undefined), [own, storedCards]);
  useFreshTournamentCards(owner);
  const refused = useStored(() => refusedPractice(localDb(), owner), `refused-practice:${owner ?? 'none'}`);
  const history = [
    ...(sessions ?? []).map((s) => ({ ...s, at: s.session.startedAt, kind: 'practice' as const })),
    ...(cards ?? []).map((c) => ({ ...c, at: c.card.startedAt, kind: 'tournament' as const })),
  ].sort((a, b) => b.at.localeCompare(a.at));
  // The newest first, the rest on request: a year is 300 lines, which also cost the tap that
  // leaves the log (taking them down) far more than the screen it opens.
  const shown = whole ? history : history.slice(0, LOG_FIRST_LINES);
  const remove = (id: string) => void deletePracticeSession(id).then((gone) => setDeleted(gone));
  const exportCsv = async () => {
    const own = await ownPractice(owner);
    const csv = practiceCsv(own.sessions, own.ends);
    saveFile(
      new Blob([csv], { type: 'text/csv;charset=utf-8' }),
      `ringcall-practice-${new Date().toISOString().slice(0, 10)}.csv`,
    );
  };
  const undo = () => {
    if (!deleted) return;
    void restorePracticeSession(deleted).then(() => setDeleted(undefined));
  };

  return (
    <section aria-labelledby="past-practice" className="space-y-3">
      <h2 id="past-practice" className="text-2xl font-bold">
        Your log
      </h2>
      {deleted && (
        <div
          className="surface flex items-center justify-between gap-3 rounded-lg border-2 border-ink/40 bg-card p-3"
          role="status"
        >
          <span>Deleted {sessionTitle(deleted.session)}.</span>
          <Button variant="secondary" onClick={undo}>
            Undo
          </Button>
        </div>
      )}
      {refused && refused.length > 0 && (
        <Notice tone="error">
          Some practice did not reach your account: {refused.join(' ')} It stays on this phone.
        </Notice>
      )}
      {sessions && cards && history.length === 0 && (
        <p>No practice yet. Pick a round or free practice above: your first session will be listed here.</p>
      )}
      <ul className="space-y-2" data-testid="practice-sessions">
        {shown.map((item) =>
          item.kind === 'tournament' ? (
            <li
              key={`${item.card.sessionId}:${item.card.entryId}`}
              className="surface flex min-h-11 flex-col justify-center rounded-xl border border-line bg-card p-3"
            >
              <span className="font-bold">{tournamentTitle(item.card)}</span>
              <span>
                {new Date(item.card.startedAt).toLocaleDateString()} · Tournament ·{' '}
                {BOW_STYLE_LABELS[item.card.bowStyle]} · {item.tally.total} from {item.tally.arrows} arrows
                {item.tally.arrows > 0 && ` · ${item.tally.averagePerArrow.toFixed(2)} an arrow`}
                {!item.card.final && ' · card not signed yet'}
              </span>
            </li>
          ) : (
            <li
              key={item.session.id}
              className="surface flex items-center gap-3 rounded-xl border border-line bg-card p-3"
            >
              <Link
                to={`/practice/${item.session.id}`}
                className="flex min-h-11 min-w-0 flex-1 flex-col justify-center"
              >
                <span className="font-bold underline">{sessionTitle(item.session)}</span>
                <span>
                  {new Date(item.session.startedAt).toLocaleDateString()} ·{' '}
                  {BOW_STYLE_LABELS[item.session.bowStyle]} · {item.tally.total} from {item.tally.arrows}{' '}
                  arrows
                  {item.tally.arrows > 0 && ` · ${item.tally.averagePerArrow.toFixed(2)} an arrow`}
                  {!item.session.finishedAt && ' · not finished'}
                </span>
                {item.session.revivedAt && (
                  <span data-testid="practice-revived">
                    Back after a deletion: one of your phones changed it after another deleted it, so nothing
                    was lost.
                  </span>
                )}
              </Link>
              <Button
                variant="danger"
                className="px-3"
                onClick={() => remove(item.session.id)}
                aria-label={`Delete ${sessionTitle(item.session)}`}
              >
                Delete
              </Button>
            </li>
          ),
        )}
      </ul>
      {shown.length < history.length && (
        <Button variant="secondary" className="w-full" onClick={() => setWhole(true)}>
          Show the whole log ({history.length})
        </Button>
      )}
      {history.length > 0 && (
        <Link
          to="/practice/progress"
          className="flex min-h-14 w-full items-center justify-center rounded-lg border-2 border-ink bg-card px-5 text-lg font-bold text-ink"
        >
          Progress over weeks
        </Link>
      )}
      {sessions && sessions.length > 0 && (
        <Button variant="secondary" className="w-full" onClick={() => void exportCsv()}>
          Export the log as CSV
        </Button>
      )}
    </section>
  );
}
