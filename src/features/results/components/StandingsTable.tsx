import type { DivisionStandings } from '../../../contract/results';
import { TRUST_LABEL, placeText, shootOffText } from './labels';
import { CELL, ResultsTable } from './ResultsTable';

/** One division's standings: place, archer, counts for ties, how far each row can be trusted. */
export function StandingsTable({
  division,
  className,
}: {
  division: DivisionStandings;
  /** Show this class of the division (its own places) instead of the whole division. */
  className?: string;
}) {
  const title = className === undefined ? division.name : `${division.name}, ${className}`;
  const rows =
    className === undefined
      ? division.rows
      : (division.classes.find((c) => c.name === className)?.rows ?? []);
  // The cut line belongs to the division's ranking only.
  const cutAt = className === undefined ? division.cut : null;
  return (
    <ResultsTable
      label={`Standings of ${title}`}
      caption={<caption className="sr-only">Standings of {title}</caption>}
      testId={`standings-${division.divisionId}${className === undefined ? '' : `-${className}`}`}
      columns={[
        { label: 'Place' },
        { label: 'Archer' },
        { label: 'Total', numeric: true },
        { label: '10s', numeric: true },
        { label: division.secondCount, numeric: true },
        { label: 'Ends', numeric: true },
        { label: 'Status' },
      ]}
    >
      {rows.map((r, i) => {
        const cut = cutAt !== null && i === cutAt;
        const trust = TRUST_LABEL[r.trust];
        const flag = shootOffText(r);
        return (
          <tr
            key={r.entryId}
            data-testid={`${className === undefined ? 'standing' : 'class-standing'}-${r.entryId}`}
            className={`border-b border-line ${cut ? 'border-t-4 border-t-ink' : ''}`}
          >
            <td className={`${CELL} text-xl font-bold`}>{placeText(r)}</td>
            <td className={`${CELL}`}>
              <span className="font-bold">{r.name}</span>
              {r.club && <span className="block text-base text-ink-soft">{r.club}</span>}
              {className === undefined && r.className && (
                <span className="block text-base text-ink-soft">{r.className}</span>
              )}
            </td>
            <td className={`${CELL} text-right text-xl font-bold`} data-testid="total">
              {r.total}
            </td>
            <td className={`${CELL} text-right`}>{r.tens}</td>
            <td className={`${CELL} text-right`}>{r.second}</td>
            <td className={`${CELL} text-right`}>
              {r.endsShot}/{r.totalEnds}
            </td>
            <td className={`${CELL}`}>
              <span>
                <span aria-hidden="true">{trust.mark} </span>
                {trust.word}
              </span>
              {flag && (
                <span className={`block font-bold ${r.shootOff ? 'text-brick' : ''}`}>
                  <span aria-hidden="true">{r.shootOff ? '▲ ' : '◆ '}</span>
                  {flag}
                </span>
              )}
            </td>
          </tr>
        );
      })}
    </ResultsTable>
  );
}
