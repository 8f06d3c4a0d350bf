import { TASKS, type Task } from '../../contract/fieldTerms';
import { Notice } from '../Notice';
import { SelectField } from '../SelectField';
import { TASK_LABELS } from './taskNames';
import { useSetMemberTask, useTargetMembers } from '../../api/targetMembers';

/**
 * Who keeps which task on a target, for a judge to free a task (the person leaves the group) or
 * give it to another member when its keeper is gone or stuck. Needs signal.
 */
export function TargetGroup({
  eventId,
  sessionId,
  targetNumber,
}: {
  eventId: number;
  sessionId: number;
  targetNumber: number;
}) {
  const members = useTargetMembers(eventId, sessionId, targetNumber);
  const setTask = useSetMemberTask(eventId, sessionId, targetNumber);
  return (
    <section
      aria-labelledby="target-group"
      className="surface space-y-2 rounded-xl border border-line bg-card p-3"
      data-testid="target-group"
    >
      <h2 id="target-group" className="font-bold">
        People on target {targetNumber}
      </h2>
      {members.error && <Notice tone="error">{members.error.message}</Notice>}
      {members.data?.length === 0 && <p>Nobody has joined this target yet.</p>}
      <ul className="space-y-2">
        {members.data?.map((m) => (
          <li key={m.userId}>
            <SelectField
              label={m.name}
              value={m.task}
              disabled={setTask.isPending}
              onChange={(e) => setTask.mutate({ userId: m.userId, task: e.target.value as Task | 'none' })}
            >
              {TASKS.map((t) => (
                <option key={t} value={t}>
                  {TASK_LABELS[t]}
                </option>
              ))}
              <option value="none">Free the task (leaves the target)</option>
            </SelectField>
          </li>
        ))}
      </ul>
      {setTask.error && <Notice tone="error">{setTask.error.message}</Notice>}
    </section>
  );
}
