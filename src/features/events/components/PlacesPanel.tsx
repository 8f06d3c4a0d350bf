import { useState, type RefObject } from 'react';
import { POSITIONS, type Position, type TargetList } from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { Notice } from '../../../ui/Notice';
import { SelectField } from '../../../ui/SelectField';

type Candidate = { entryId: number; label: string; placed: boolean };

function candidates(list: TargetList): Candidate[] {
  const placed = list.targets.flatMap((t) =>
    t.archers.map((a) => ({
      entryId: a.entryId,
      label: `${t.targetNumber}${a.position} · ${a.name} (${a.divisionName})`,
      placed: true,
    })),
  );
  const waiting = list.unassigned.map((u) => ({
    entryId: u.entryId,
    label: `No target · ${u.name} (${u.divisionName})`,
    placed: false,
  }));
  return [...waiting, ...placed];
}

/** Change places by hand: pick an archer, then move them to a target and position, or swap them with another. */
export function PlacesPanel({
  list,
  picked,
  onPick,
  onMove,
  onSwap,
  onUnassign,
  pending,
  error,
  panelRef,
}: {
  list: TargetList;
  picked: number | undefined;
  onPick: (entryId: number | undefined) => void;
  onMove: (input: { entryId: number; targetNumber: number; position: Position }) => void;
  onSwap: (input: { entryId: number; otherEntryId: number }) => void;
  onUnassign: (entryId: number) => void;
  pending: boolean;
  error: Error | null;
  panelRef: RefObject<HTMLElement | null>;
}) {
  const all = candidates(list);
  const [targetNumber, setTargetNumber] = useState('');
  const [position, setPosition] = useState<Position>('A');
  const [other, setOther] = useState('');
  const [problem, setProblem] = useState<string>();
  const current = all.find((c) => c.entryId === picked);

  const move = () => {
    const n = Number(targetNumber);
    if (!picked) return setProblem('Choose an archer first.');
    if (!Number.isInteger(n) || n < 1) return setProblem('Enter a target number: 1 or more.');
    setProblem(undefined);
    onMove({ entryId: picked, targetNumber: n, position });
  };
  const swap = () => {
    if (!picked) return setProblem('Choose an archer first.');
    if (!other) return setProblem('Choose the archer to swap with.');
    setProblem(undefined);
    onSwap({ entryId: picked, otherEntryId: Number(other) });
  };

  return (
    <section
      ref={panelRef}
      tabIndex={-1}
      aria-labelledby="change-places"
      className="surface space-y-4 rounded-xl border-2 border-ink bg-card p-4"
    >
      <h2 id="change-places" className="text-2xl font-bold">
        Change places
      </h2>
      <SelectField
        label="Archer"
        value={picked ?? ''}
        onChange={(e) => onPick(e.target.value ? Number(e.target.value) : undefined)}
      >
        <option value="">Choose an archer</option>
        {all.map((c) => (
          <option key={c.entryId} value={c.entryId}>
            {c.label}
          </option>
        ))}
      </SelectField>
      <div className="grid gap-4 md:grid-cols-2">
        <fieldset className="space-y-3">
          <legend className="font-bold">Move to a free place</legend>
          <div className="grid grid-cols-2 gap-3">
            <Field
              label="Target"
              inputMode="numeric"
              value={targetNumber}
              onChange={(e) => setTargetNumber(e.target.value.replace(/\D/g, ''))}
            />
            <SelectField
              label="Position"
              value={position}
              onChange={(e) => setPosition(e.target.value as Position)}
            >
              {POSITIONS.map((p) => (
                <option key={p} value={p}>
                  {p}
                </option>
              ))}
            </SelectField>
          </div>
          <Button onClick={move} disabled={pending}>
            Move here
          </Button>
        </fieldset>
        <fieldset className="space-y-3">
          <legend className="font-bold">Or swap with another archer</legend>
          <SelectField label="Swap with" value={other} onChange={(e) => setOther(e.target.value)}>
            <option value="">Choose an archer on a target</option>
            {all
              .filter((c) => c.placed && c.entryId !== picked)
              .map((c) => (
                <option key={c.entryId} value={c.entryId}>
                  {c.label}
                </option>
              ))}
          </SelectField>
          <Button variant="secondary" onClick={swap} disabled={pending}>
            Swap places
          </Button>
        </fieldset>
      </div>
      {current?.placed && (
        <Button variant="danger" onClick={() => onUnassign(current.entryId)} disabled={pending}>
          Take off the target
        </Button>
      )}
      {problem && <Notice tone="error">{problem}</Notice>}
      {error && <Notice tone="error">{error.message}</Notice>}
    </section>
  );
}
