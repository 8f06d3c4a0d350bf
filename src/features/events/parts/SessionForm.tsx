import { useState, type FormEvent } from 'react';
import { ROUND_CATALOG, getFace, roundArrowCount, type BowStyle } from '../../../core';
import {
  sessionInputSchema,
  type Division,
  type EventSession,
  type SessionInput,
} from '../../../contract/events';
import { Button } from '../../../ui/Button';
import { Field } from '../../../ui/Field';
import { Notice } from '../../../ui/Notice';
import { SelectField } from '../../../ui/SelectField';
import { formProblems } from '../components/formProblems';
import {
  CustomRoundFields,
  customRoundFromSummary,
  customRoundPayload,
  emptyCustomRound,
  type CustomRoundDraft,
} from './CustomRoundFields';

type Choice = { kind: 'none' | 'catalog' | 'custom'; roundId: string; custom: CustomRoundDraft };

const roundLabel = (id: string) => {
  const round = ROUND_CATALOG.find((r) => r.id === id)!;
  const faces = [...new Set(round.distances.map((d) => getFace(d.faceId).label))].join(', then ');
  return `${round.name} · ${roundArrowCount(round)} arrows · ${faces}`;
};

function initialChoices(divisions: Division[], session?: EventSession): Record<number, Choice> {
  const choices: Record<number, Choice> = {};
  for (const d of divisions) {
    const existing = session?.rounds.find((r) => r.divisionId === d.id);
    const firstFit = ROUND_CATALOG.find((r) => r.bowStyles.includes(d.bowStyle))?.id ?? '';
    if (!existing)
      choices[d.id] = { kind: session ? 'none' : 'catalog', roundId: firstFit, custom: emptyCustomRound() };
    else if (existing.round.custom)
      choices[d.id] = { kind: 'custom', roundId: firstFit, custom: customRoundFromSummary(existing.round) };
    else choices[d.id] = { kind: 'catalog', roundId: existing.round.id, custom: emptyCustomRound() };
  }
  return choices;
}

/** A session's name, local start, and the round each division shoots in it (or not shooting). */
export function SessionForm({
  divisions,
  session,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  divisions: Division[];
  session?: EventSession;
  pending: boolean;
  error: Error | null;
  onSubmit: (input: SessionInput) => void;
  onCancel?: () => void;
}) {
  const [name, setName] = useState(session?.name ?? '');
  const [startsAt, setStartsAt] = useState(session?.startsAt ?? '');
  const [choices, setChoices] = useState(() => initialChoices(divisions, session));
  const [problems, setProblems] = useState<Record<string, string>>({});
  const choose = (divisionId: number, patch: Partial<Choice>) =>
    setChoices((c) => ({ ...c, [divisionId]: { ...c[divisionId]!, ...patch } }));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const rounds = divisions.flatMap((d): unknown[] => {
      const c = choices[d.id]!;
      if (c.kind === 'none') return [];
      if (c.kind === 'catalog') return [{ divisionId: d.id, roundId: c.roundId }];
      return [{ divisionId: d.id, customRound: customRoundPayload(c.custom, d.bowStyle as BowStyle) }];
    });
    const parsed = sessionInputSchema.safeParse({ name, startsAt, rounds });
    if (!parsed.success) return setProblems(formProblems(parsed.error));
    setProblems({});
    onSubmit(parsed.data);
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
    >
      <h3 className="text-xl font-bold">{session ? `Edit ${session.name}` : 'Add a session'}</h3>
      <Field
        label="Session name"
        hint="For example Saturday morning, or Qualification."
        value={name}
        onChange={(e) => setName(e.target.value)}
        error={problems.name}
      />
      <Field
        label="Start"
        hint="Date and time at the venue."
        type="datetime-local"
        value={startsAt}
        onChange={(e) => setStartsAt(e.target.value)}
        error={problems.startsAt}
      />
      <fieldset className="space-y-4">
        <legend className="font-bold">Round for each division</legend>
        {divisions.map((d) => {
          const c = choices[d.id]!;
          const value = c.kind === 'catalog' ? c.roundId : c.kind;
          return (
            <div key={d.id} className="space-y-2">
              <SelectField
                label={d.name}
                value={value}
                onChange={(e) => {
                  const v = e.target.value;
                  if (v === 'none' || v === 'custom') choose(d.id, { kind: v });
                  else choose(d.id, { kind: 'catalog', roundId: v });
                }}
              >
                <option value="none">Not shooting in this session</option>
                {ROUND_CATALOG.filter((r) => r.bowStyles.includes(d.bowStyle)).map((r) => (
                  <option key={r.id} value={r.id}>
                    {roundLabel(r.id)}
                  </option>
                ))}
                <option value="custom">A custom round…</option>
              </SelectField>
              {c.kind === 'custom' && (
                <CustomRoundFields
                  divisionName={d.name}
                  draft={c.custom}
                  onChange={(custom) => choose(d.id, { custom })}
                />
              )}
            </div>
          );
        })}
      </fieldset>
      {problems.rounds && <Notice tone="error">{problems.rounds}</Notice>}
      {error && <Notice tone="error">{error.message}</Notice>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>
          {session ? 'Save session' : 'Add session'}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
