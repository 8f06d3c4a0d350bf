import { Activity, lazy, Suspense, useEffect, useState } from 'react';
import { useParams } from 'react-router-dom';
import { PracticeScreen } from './PracticeScreen';
import { PracticeSessionScreen } from './PracticeSessionScreen';
import { progressScreenLoader, warmProgress } from './progress/loadProgress';

// Progress has a chunk of its own, and the chart library one more after it: the log stays light
// (the log warms them while idle: warmProgress).
const ProgressScreen = lazy(progressScreenLoader);

/**
 * /practice is the log, /practice/progress progress over weeks, /practice/<session id> one
 * session. One route entry: the shell's route table grows by one entry, and what only practice
 * uses (plotting, group statistics, the drawn face) stays in this chunk instead of joining one the
 * pad shares.
 */
export function PracticeArea() {
  const rest = useParams()['*'] ?? '';
  const onLog = rest === '';
  const onProgress = rest === 'progress';
  // Once the log sits idle with progress's code warmed, progress is drawn ahead, unseen (React's
  // Activity, hidden: no effects, no chart yet); the tap on "Progress over weeks" only shows it and
  // draws the chart. A first visit otherwise built its whole page in the tap (bench/progress.bench.ts).
  const [ahead, setAhead] = useState(false);
  useEffect(() => (onLog ? warmProgress(() => setAhead(true)) : undefined), [onLog]);
  return (
    <>
      {onLog && <PracticeScreen />}
      {!onLog && !onProgress && <PracticeSessionScreen sessionId={rest} />}
      {(onProgress || (onLog && ahead)) && (
        <Activity mode={onProgress ? 'visible' : 'hidden'}>
          <Suspense fallback={null}>
            <ProgressScreen />
          </Suspense>
        </Activity>
      )}
    </>
  );
}
