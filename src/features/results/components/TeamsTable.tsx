import type { DivisionStandings } from '../../../contract/results';
import { placeText } from './labels';
import { CELL, ResultsTable } from './ResultsTable';

/** Team places of one division: the club, its counting archers, the sum. */
export function TeamsTable({ division }: { division: DivisionStandings }) {
  if (division.teams.length === 0) return null;
  return (
    <ResultsTable
      label={`Teams of ${division.name}`}
      caption={<caption className={`${CELL} text-left text-xl font-bold`}>Teams, {division.name}</caption>}
      columns={[
        { label: 'Place' },
        { label: 'Club' },
        { label: 'Total', numeric: true },
        { label: '10s', numeric: true },
        { label: division.secondCount, numeric: true },
      ]}
    >
      {division.teams.map((t) => (
        <tr key={t.club} className="border-b border-line">
          <td className={`${CELL} text-xl font-bold`}>{placeText(t)}</td>
          <td className={`${CELL}`}>
            <span className="font-bold">{t.club}</span>
            <span className="block text-base text-ink-soft">
              {t.members.map((m) => `${m.name} ${m.total}`).join(' · ')}
            </span>
            {t.shootOff && (
              <span className="block font-bold text-brick">
                <span aria-hidden="true">▲ </span>shoot-off needed
              </span>
            )}
          </td>
          <td className={`${CELL} text-right text-xl font-bold`}>{t.total}</td>
          <td className={`${CELL} text-right`}>{t.tens}</td>
          <td className={`${CELL} text-right`}>{t.second}</td>
        </tr>
      ))}
    </ResultsTable>
  );
}
