import { getFace } from '../../core';
import type { PracticeTally } from '../../core/practice';
import type { PracticeEndRow } from '../../local/db';
import { ArrowMark, TargetFace } from './TargetFace';
import { describeCentre, summarize, type DistancePart } from './summary';

const percent = (share: number) => `${Math.round(share * 100)}%`;

function TallyList({ tally }: { tally: PracticeTally }) {
  const rows: [string, string][] = [
    ['Total', `${tally.total} from ${tally.arrows} arrow${tally.arrows === 1 ? '' : 's'}`],
    ['Average per arrow', tally.averagePerArrow.toFixed(2)],
    ['10s (with Xs)', `${tally.tens} · ${percent(tally.tenRate)}`],
    ['Xs', `${tally.xs} · ${percent(tally.xRate)}`],
    ['Hits', String(tally.hits)],
  ];
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
      {rows.map(([term, value]) => (
        <div key={term} className="contents">
          <dt>{term}</dt>
          <dd className="font-bold">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

function Group({ part }: { part: DistancePart }) {
  const { group, faceId } = part;
  if (!group) return <p>No plotted arrows here: plot arrows on the face to see the group.</p>;
  const face = getFace(faceId);
  // A closer look: the group and the centre, at least three zones across, at most the whole face.
  const reach = Math.max(...part.points.map((p) => Math.hypot(p.xMm, p.yMm)), 3 * face.zoneWidthMm);
  const outer = face.zones[face.zones.length - 1]?.outerRadiusMm ?? face.diameterMm / 2;
  const viewRadius = Math.min(reach * 1.15, outer * 1.08);
  const r = viewRadius / 35;
  return (
    <div className="space-y-2">
      <p>
        Group centre: <strong>{describeCentre(group)}</strong>. Half the arrows within{' '}
        <strong>{Math.round(group.spreadMm)} mm</strong> of it ({group.arrows} plotted).
      </p>
      <TargetFace
        faceId={faceId}
        singleSpot
        view={{ x: -viewRadius, y: -viewRadius, width: 2 * viewRadius, height: 2 * viewRadius }}
        label={`Plotted arrows on the ${face.label}, with the group centre ${describeCentre(group)} and a circle of ${Math.round(group.spreadMm)} mm around it`}
        className="max-w-sm"
      >
        {part.points.map((p, i) => (
          <ArrowMark key={i} x={p.xMm} y={p.yMm} r={r} />
        ))}
        {/* The spread's circle: a dark line on a dashed light one, seen on every zone colour. */}
        {[
          { stroke: '#ffffff', width: 0.9, dash: `${r * 2} ${r}` },
          { stroke: '#1b1b1b', width: 0.4, dash: undefined },
        ].map((line) => (
          <circle
            key={line.stroke}
            cx={group.centre.xMm}
            cy={group.centre.yMm}
            r={Math.max(group.spreadMm, r)}
            fill="none"
            stroke={line.stroke}
            strokeWidth={r * line.width}
            strokeDasharray={line.dash}
          />
        ))}
        <path
          d={`M ${group.centre.xMm - 3 * r} ${group.centre.yMm} h ${6 * r} M ${group.centre.xMm} ${group.centre.yMm - 3 * r} v ${6 * r}`}
          stroke="#1b1b1b"
          strokeWidth={r * 0.8}
        />
      </TargetFace>
    </div>
  );
}

/** A session's statistics: the whole, then each distance with its group drawn on the face. */
export function SessionSummary({ ends }: { ends: readonly PracticeEndRow[] }) {
  const summary = summarize(ends);
  return (
    <section
      aria-labelledby="practice-summary"
      className="surface space-y-4 rounded-xl border border-line bg-card p-4"
      data-testid="practice-summary"
    >
      <h2 id="practice-summary" className="text-2xl font-bold">
        Summary
      </h2>
      <TallyList tally={summary.tally} />
      {summary.parts.map((part) => (
        <section key={`${part.distanceM}:${part.faceId}`} className="space-y-2 border-t border-line pt-3">
          <h3 className="text-xl font-bold">
            {part.distanceM} m, {getFace(part.faceId).label}
          </h3>
          {summary.parts.length > 1 && <TallyList tally={part.tally} />}
          <Group part={part} />
        </section>
      ))}
    </section>
  );
}
