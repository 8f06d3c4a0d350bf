import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { apiRequest, messageOf } from '../../api/request';
import { localDb, type JoinedTarget } from '../../local/db';
import { useOnline } from '../../local/online';
import { TASK_LABELS } from '../../ui/scorecard/taskNames';

/**
 * Leaves the task on this target so someone else can take it. Not while this phone still holds
 * changes the server has not got: leaving would cut them off from the target.
 */
export function LeaveTask({
  target,
  unsent,
}: {
  target: JoinedTarget;
  /** This person's changes on the target that have not reached the server yet (from the pad's read). */
  unsent: number;
}) {
  const online = useOnline();
  const navigate = useNavigate();
  const [asking, setAsking] = useState(false);
  const [problem, setProblem] = useState<string>();
  const [leaving, setLeaving] = useState(false);

  const leave = async () => {
    setLeaving(true);
    setProblem(undefined);
    try {
      await apiRequest<void>(`/api/targets/${target.session.id}/${target.targetNumber}/leave`, {
        method: 'POST',
      });
      await localDb().targets.delete(target.key);
      navigate('/');
    } catch (error) {
      setProblem(`Could not leave the target: ${messageOf(error)}`);
      setLeaving(false);
    }
  };

  return (
    <section
      aria-labelledby="leave-task"
      className="surface space-y-2 rounded-xl border border-line bg-card p-3"
    >
      <h2 id="leave-task" className="font-bold">
        Leave {TASK_LABELS[target.task].toLowerCase()} on target {target.targetNumber}
      </h2>
      {unsent ? (
        <p role="status" className="font-bold text-caution-ink">
          <span aria-hidden="true">▲ </span>
          {unsent === 1 ? '1 change has' : `${unsent} changes have`} not reached the event server yet. Leave
          once they are sent (or save them as a file for a judge), so nothing is lost.
        </p>
      ) : asking ? (
        <div role="group" aria-label="Leave this target?" className="space-y-2">
          <p>Someone else can then take the task with the join code. You can join again later.</p>
          <div className="flex flex-wrap gap-2">
            <button
              type="button"
              disabled={leaving || !online}
              onClick={() => void leave()}
              className="min-h-14 rounded-lg border-2 border-brick bg-card px-5 text-lg font-bold text-brick disabled:opacity-50"
            >
              Yes, leave it
            </button>
            <button
              type="button"
              onClick={() => setAsking(false)}
              className="min-h-14 rounded-lg border-2 border-ink bg-card px-5 text-lg font-bold text-ink"
            >
              Stay
            </button>
          </div>
          {!online && <p>Leaving needs signal.</p>}
        </div>
      ) : (
        <button
          type="button"
          onClick={() => setAsking(true)}
          className="min-h-14 rounded-lg border-2 border-ink bg-card px-5 text-lg font-bold text-ink"
        >
          Leave this task
        </button>
      )}
      {problem && (
        <p role="alert" className="font-bold text-brick">
          {problem}
        </p>
      )}
    </section>
  );
}
