import { useParams } from 'react-router-dom';
import { PracticeScreen } from './PracticeScreen';
import { PracticeSessionScreen } from './PracticeSessionScreen';

/**
 * /practice is the log, /practice/<session id> one session. One route entry and one chunk: the
 * shell's route table grows by one entry, and what only practice uses (plotting, group statistics,
 * the drawn face) stays in this chunk instead of joining one the pad shares.
 */
export function PracticeArea() {
  const sessionId = useParams()['*'] ?? '';
  return sessionId === '' ? <PracticeScreen /> : <PracticeSessionScreen sessionId={sessionId} />;
}
