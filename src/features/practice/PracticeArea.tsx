import { lazy, Suspense } from 'react';
import { useParams } from 'react-router-dom';
import { PracticeScreen } from './PracticeScreen';
import { PracticeSessionScreen } from './PracticeSessionScreen';
import { progressScreenLoader } from './progress/loadProgress';

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
  const sessionId = useParams()['*'] ?? '';
  if (sessionId === 'progress')
    return (
      <Suspense fallback={null}>
        <ProgressScreen />
      </Suspense>
    );
  return sessionId === '' ? <PracticeScreen /> : <PracticeSessionScreen sessionId={sessionId} />;
}
