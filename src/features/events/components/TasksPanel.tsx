import { useState } from 'react';
import { TargetGroup } from '../../../ui/scorecard/TargetGroup';

/**
 * For the organizer during the session: who keeps which task on a target, to free a task whose
 * keeper is gone or give it to another member (the judges do the same from their desk).
 */
export function TasksPanel({
  eventId,
  sessionId,
  targetNumbers,
}: {
  eventId: number;
  sessionId: number;
  targetNumbers: number[];
}) {
  const [target, setTarget] = useState<number>();
  return (
    <section aria-labelledby="tasks" className="space-y-2">
      <h2 id="tasks" className="text-2xl font-bold">
        Tasks on a target
      </h2>
      <label className="block">
        <span className="block font-bold">Target to look at</span>
        <select
          value={target ?? ''}
          onChange={(e) => setTarget(e.target.value ? Number(e.target.value) : undefined)}
          className="surface min-h-14 w-full rounded-lg border-2 border-line bg-card px-3 text-lg"
        >
          <option value="">Choose a target</option>
          {targetNumbers.map((n) => (
            <option key={n} value={n}>
              Target {n}
            </option>
          ))}
        </select>
      </label>
      {target !== undefined && <TargetGroup eventId={eventId} sessionId={sessionId} targetNumber={target} />}
    </section>
  );
}
