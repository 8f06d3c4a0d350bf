import type { DivisionStandings } from '../../../contract/results';
import { TRUST_LABEL, placeText, shootOffText } from './labels';
import { CELL, ResultsTable } from './ResultsTable';

/** One division's standings: place, archer, counts for ties, how far each row can be trusted. */
export function StandingsTable({ division }: { division: DivisionStandings }) {
  return (
    <ResultsTable
      label={`Standings of ${division.name}`}
      caption={<caption className="sr-only">Standings of {division.name}</caption>}
      testId={`standings-${division.divisionId}`}
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
      {division.rows.map((r, i) => {
        const cut = division.cut !== null && i === division.cut;
        const trust = TRUST_LABEL[r.trust];
        const flag = shootOffText(r);
        return (
          <tr
            key={r.entryId}
            data-testid={`standing-${r.entryId}`}
            className={`border-b border-line ${cut ? 'border-t-4 border-t-ink' : ''}`}
          >
            <td className={`${CELL} text-xl font-bold`}>{placeText(r)}</td>
            <td className={`${CELL}`}>
              <span className="font-bold">{r.name}</span>
              {r.club && <span className="block text-base text-ink-soft">{r.club}</span>}
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
