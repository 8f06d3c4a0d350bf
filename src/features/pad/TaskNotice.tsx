import { useNavigate } from 'react-router-dom';
import { localDb, type JoinedTarget } from '../../local/db';
import { Notice } from '../../ui/Notice';
import { TASK_LABELS } from '../../ui/scorecard/taskNames';
import { useServerTask } from './useServerTask';

/** Says so when a judge or organizer changed this person's task on the target, or took them off it. */
export function TaskNotice({
  target,
  unsent,
}: {
  target: JoinedTarget;
  /** This person's changes on the target that have not reached the server yet (from the pad's read). */
  unsent: number;
}) {
  const found = useServerTask(target);
  const navigate = useNavigate();
  if (!found) return null;
  if (found.kind === 'changed')
    return (
      <div data-testid="task-changed">
        <Notice tone="info">
          A judge or organizer changed your task on target {target.targetNumber}: you are now{' '}
          <strong>{TASK_LABELS[found.to].toLowerCase()}</strong> (was {TASK_LABELS[found.from].toLowerCase()}
          ).
        </Notice>
      </div>
    );
  const remove = async () => {
    await localDb().targets.delete(target.key);
    navigate('/');
  };
  return (
    <div data-testid="task-removed" className="space-y-2">
      <Notice tone="error">
        A judge or organizer took you off target {target.targetNumber}: your task is free for someone else,
        and the server no longer takes values from you here. Join again with the code on the target sheet if
        you should keep a task.
      </Notice>
      {unsent ? (
        <p className="font-bold">
          {unsent === 1 ? '1 change' : `${unsent} changes`} from this phone did not reach the server first:
          save them as a file for a judge before removing the target.
        </p>
      ) : (
        <button
          type="button"
          onClick={() => void remove()}
          className="min-h-14 rounded-lg border-2 border-ink bg-card px-5 text-lg font-bold text-ink"
        >
          Remove target {target.targetNumber} from this phone
        </button>
      )}
    </div>
  );
}
