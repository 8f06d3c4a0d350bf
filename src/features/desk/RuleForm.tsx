import { useState, type FormEvent } from 'react';
import { endsOfRound, rulesForEnd, sortEnd, type ArrowValue } from '../../core';
import { messageOf } from '../../api/request';
import { localDb } from '../../local/db';
import { recordChange } from '../../local/outbox';
import { syncLoop } from '../../local/syncLoop';
import { useOnline } from '../../local/online';
import { Button } from '../../ui/Button';
import { Field } from '../../ui/Field';
import { FileField, photoInput } from '../../ui/FileField';
import { Notice } from '../../ui/Notice';
import { startingValues, type DeskItem } from './deskItems';
import { uploadPhoto } from '../../api/uploadPhoto';

/** A judge's ruling on one end: every value (any value valid on the face), a reason, and a photo if there is signal. */
export function RuleForm({
  item,
  eventId,
  userId,
  onDone,
}: {
  item: DeskItem;
  eventId: number;
  userId: number;
  onDone: () => void;
}) {
  const archer = item.target.archers[item.archerIndex]!;
  const end = endsOfRound(archer.round)[item.endIndex]!;
  const allowed = rulesForEnd(archer.round, end, archer.bowStyle).allowed;
  const [arrows, setArrows] = useState<(ArrowValue | '')[]>(() => startingValues(item, end.arrows));
  const [reason, setReason] = useState('');
  const [photo, setPhoto] = useState<File>();
  const [problem, setProblem] = useState<string>();
  const [busy, setBusy] = useState(false);
  const online = useOnline();

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    if (arrows.some((a) => a === '')) return setProblem(`Give a value for all ${end.arrows} arrows.`);
    if (reason.trim().length < 3) return setProblem('Give a short reason for the ruling.');
    setBusy(true);
    try {
      const photoId = photo ? (await uploadPhoto(eventId, photo)).photoId : undefined;
      await recordChange(localDb(), userId, {
        kind: 'end.rule',
        args: {
          sessionId: item.target.session.id,
          entryId: archer.entryId,
          endIndex: item.endIndex,
          arrows: sortEnd(arrows as ArrowValue[]),
          reason: reason.trim(),
          ...(photoId ? { photoId } : {}),
        },
      });
      syncLoop().kick();
      onDone();
    } catch (error) {
      setProblem(messageOf(error));
    } finally {
      setBusy(false);
    }
  };

  return (
    <form
      onSubmit={(e) => void submit(e)}
      className="surface space-y-3 rounded-xl border-2 border-ink bg-card p-3"
    >
      <h3 className="text-xl font-bold">
        Ruling: target {item.target.targetNumber}
        {archer.position}, {archer.name}, end {item.endIndex + 1}
      </h3>
      <p className="text-base">
        The writers' values and the history stay on record; your ruling decides the end.
      </p>
      <div className="grid grid-cols-3 gap-2">
        {arrows.map((value, i) => (
          <label key={i} className="block">
            <span className="block font-bold" aria-hidden="true">
              Arrow {i + 1}
            </span>
            <select
              aria-label={`Arrow ${i + 1}`}
              value={value}
              onChange={(e) =>
                setArrows((all) => all.map((a, j) => (j === i ? (e.target.value as ArrowValue) : a)))
              }
              className="surface min-h-14 w-full rounded-lg border-2 border-line bg-card px-2 text-2xl font-bold"
            >
              <option value="">–</option>
              {allowed.map((v) => (
                <option key={v} value={v}>
                  {v}
                </option>
              ))}
            </select>
          </label>
        ))}
      </div>
      <Field
        label="Reason"
        hint="For example: line call on arrow 3, the shaft touches the 9."
        value={reason}
        onChange={(e) => setReason(e.target.value)}
      />
      <FileField
        label="Photo of the target (optional)"
        hint={online ? undefined : 'Photos need signal. The ruling itself works without it.'}
        {...photoInput}
        disabled={!online}
        onChange={(e) => setPhoto(e.target.files?.[0])}
      />
      {problem && <Notice tone="error">{problem}</Notice>}
      <div className="flex gap-2">
        <Button type="submit" disabled={busy}>
          {busy ? 'Saving…' : 'Record ruling'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
