import { useCallback, useState } from 'react';
import { Link } from 'react-router-dom';
import { arrowPoints, scoringValues } from '../../core';
import type { ArrowValue } from '../../core';
import { countedValues, isPlotted } from '../../core/practice';
import type { PracticeArrow } from '../../core/practice';
import { NO_ACCOUNT, localDb, type PracticeEndRow, type PracticeSessionRow } from '../../local/db';
import { usePhoneOwner } from '../../local/phoneOwner';
import { ArrowKeypad } from '../../ui/scorecard/ArrowKeypad';
import { EndValues } from './EndValues';
import { SafetyNote } from '../../ui/SafetyNote';
import { Button } from '../../ui/Button';
import { BOW_STYLE_LABELS, endSetup, nextEndIndex, plannedEnds, sessionTitle } from './plan';
import { addPracticeArrow, finishPracticeSession, practiceEnds, undoPracticeArrow } from './practiceStore';
import { PlotFace } from './PlotFace';
import { SessionSummary } from './SessionSummary';
import { useStored } from './useStored';

type Mode = 'plot' | 'keys';
const MODE_KEY = 'ringcall.practiceMode';

function savedMode(): Mode {
  try {
    return localStorage.getItem(MODE_KEY) === 'keys' ? 'keys' : 'plot';
  } catch {
    return 'plot';
  }
}

const linkClass = 'inline-flex min-h-11 items-center text-base font-bold underline';

/** One practice session: enter or plot the next arrows, then its summary. Works from IndexedDB alone. */
export function PracticeSessionScreen({ sessionId }: { sessionId: string }) {
  const owner = usePhoneOwner() ?? NO_ACCOUNT;
  const data = useStored(async () => {
    const found = await localDb().practiceSessions.get(sessionId);
    // Another person's practice on a shared phone is not theirs to see.
    const session = found?.ownerId === owner ? found : undefined;
    return { session, ends: session ? await practiceEnds(sessionId) : [] };
  }, `practice-session:${sessionId}:${owner}`);
  if (!data) return <p>Opening…</p>;
  if (!data.session)
    return (
      <div className="space-y-4">
        <h1 className="text-3xl font-bold">Practice session not found</h1>
        <p>It may have been deleted on this phone.</p>
        <Link to="/practice" className={linkClass}>
          Back to the practice log
        </Link>
      </div>
    );
  return <SessionView session={data.session} ends={data.ends} />;
}

function SessionView({ session, ends }: { session: PracticeSessionRow; ends: PracticeEndRow[] }) {
  const [mode, setMode] = useState<Mode>(savedMode);
  const [error, setError] = useState<string>();
  const plan = plannedEnds(session);
  const index = session.finishedAt ? undefined : nextEndIndex(session, ends);
  const setup = index === undefined ? undefined : endSetup(session, index);
  const current = ends.find((e) => e.index === index);
  const arrowCount = ends.reduce((n, e) => n + e.arrows.length, 0);

  const chooseMode = (next: Mode) => {
    setMode(next);
    try {
      localStorage.setItem(MODE_KEY, next);
    } catch {
      // Private mode: the choice lasts for this visit.
    }
  };
  const add = useCallback(
    (arrows: PracticeArrow[]) => {
      const tapped = performance.now();
      void (async () => {
        for (const arrow of arrows) await addPracticeArrow(session.id, arrow);
        // Read by bench/practice-plot.bench.ts: from the tap to the committed transaction.
        performance.measure('ringcall:practice-tap-to-commit', { start: tapped });
      })().catch(() => setError('This phone could not store the arrow. Try again.'));
    },
    [session.id],
  );
  const onValues = useCallback((values: ArrowValue[]) => add(values.map((value) => ({ value }))), [add]);
  const undo = useCallback(() => void undoPracticeArrow(session.id), [session.id]);

  return (
    <div className="space-y-5">
      <header className="space-y-1">
        <p>
          <Link to="/practice" className={linkClass}>
            ← Practice log
          </Link>
        </p>
        <h1 className="text-2xl font-bold leading-tight">{sessionTitle(session)}</h1>
        <p>
          {BOW_STYLE_LABELS[session.bowStyle]} · {new Date(session.startedAt).toLocaleString()}
          {session.note && <span className="block">{session.note}</span>}
        </p>
      </header>
      {setup && index !== undefined ? (
        <section aria-labelledby="practice-end" className="space-y-3">
          <h2 id="practice-end" className="text-2xl font-bold">
            End {index + 1}
            {plan ? ` of ${plan.length}` : ''} · {setup.distanceM} m
          </h2>
          <EndValues
            values={current ? countedValues(current.arrows) : []}
            slots={setup.arrows}
            label={`End ${index + 1} so far`}
          />
          {mode === 'plot' ? (
            <PlotFace
              setup={{ ...session, faceId: setup.faceId }}
              placed={(current?.arrows ?? []).filter(isPlotted).map((a) => ({ xMm: a.xMm, yMm: a.yMm }))}
              onKeep={(arrow) => add([arrow])}
            />
          ) : (
            <ArrowKeypad
              allowed={scoringValues(setup.faceId, session.bowStyle, session.venue)}
              onValues={onValues}
              onUndo={undo}
              canUndo={arrowCount > 0}
            />
          )}
          <div className="grid grid-cols-2 gap-2">
            {mode === 'plot' && (
              <Button variant="secondary" onClick={undo} disabled={arrowCount === 0}>
                ↶ Undo last arrow
              </Button>
            )}
            <Button
              variant="secondary"
              className={mode === 'plot' ? '' : 'col-span-2'}
              onClick={() => void finishPracticeSession(session.id)}
              disabled={arrowCount === 0}
            >
              Finish session
            </Button>
          </div>
          <div role="group" aria-label="How to enter arrows" className="grid grid-cols-2 gap-2">
            {(['plot', 'keys'] as const).map((m) => (
              <Button
                key={m}
                variant="secondary"
                aria-pressed={mode === m}
                onClick={() => chooseMode(m)}
                className="px-2"
              >
                {mode === m && <span aria-hidden="true">✓ </span>}
                {m === 'plot' ? 'Plot on the face' : 'Type values'}
              </Button>
            ))}
          </div>
          {error && <p role="alert">{error}</p>}
          <SafetyNote compact />
        </section>
      ) : (
        <section className="space-y-2">
          <p className="text-lg font-bold" data-testid="session-finished">
            <span aria-hidden="true">✓ </span>Session finished: {arrowCount} arrows stored on this phone.
          </p>
          {arrowCount > 0 && (
            <Button variant="secondary" onClick={undo}>
              ↶ Undo last arrow (reopens the session)
            </Button>
          )}
        </section>
      )}
      {arrowCount > 0 ? (
        <>
          <SessionSummary ends={ends} />
          <EndList ends={ends} />
        </>
      ) : (
        <p>No arrows yet. Tap where your first arrow hit, or switch to typing values.</p>
      )}
    </div>
  );
}

function EndList({ ends }: { ends: PracticeEndRow[] }) {
  const rows = ends.map((end) => {
    const values = countedValues(end.arrows);
    return { end, values, total: values.reduce((s, v) => s + arrowPoints(v), 0) };
  });
  const running = rows.map((_, i) => rows.slice(0, i + 1).reduce((s, r) => s + r.total, 0));
  return (
    <section aria-labelledby="practice-ends" className="space-y-2">
      <h2 id="practice-ends" className="text-2xl font-bold">
        Ends
      </h2>
      <ol className="space-y-2">
        {rows.map(({ end, values, total }, i) => (
          <li key={end.key} className="space-y-1">
            <p className="flex justify-between">
              <span className="font-bold">End {end.index + 1}</span>
              <span>
                <strong>{total}</strong> <span className="text-ink-soft">· running {running[i]}</span>
              </span>
            </p>
            <EndValues values={values} slots={values.length} label={`End ${end.index + 1}`} />
          </li>
        ))}
      </ol>
    </section>
  );
}
