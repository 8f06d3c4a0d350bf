import type { MatchEnd } from '../../core';
import { matchCrossCheck } from '../../core/matches';
import type { MatchDto, MatchEndArgs } from '../../contract/matches';
import { Button } from '../../ui/Button';
import { nameOf, Panel, SIDES } from '../../ui/match/MatchCardParts';

type Differing = {
  endIndex: number;
  writers: [MatchEnd, MatchEnd];
  check: ReturnType<typeof matchCrossCheck>;
};

/** The ends the match's two writers wrote differently and no judge has settled yet. */
export function differingEnds(match: MatchDto): Differing[] {
  const out: Differing[] = [];
  const indexes = [...new Set(match.writes.map((w) => w.endIndex))].sort((x, y) => x - y);
  for (const i of indexes) {
    if (match.ends[i]?.by === 'judge') continue;
    const first = match.writes.find((w) => w.endIndex === i && w.slot === 1);
    const second = match.writes.find((w) => w.endIndex === i && w.slot === 2);
    const check = matchCrossCheck(first, second);
    if (first && second && check.status === 'mismatch')
      out.push({ endIndex: i, writers: [first, second], check });
  }
  return out;
}

/**
 * A mismatch of the writers on the judge's match card: both writers' values, the arrows they
 * differ on marked, and the judge's settlement (one writer's end as it is, or the end entered anew).
 */
export function WritersDiffer({
  match,
  settle,
  enter,
}: {
  match: MatchDto;
  settle: (args: Pick<MatchEndArgs, 'endIndex' | 'a' | 'b'>) => void;
  enter: (endIndex: number) => void;
}) {
  const differing = differingEnds(match);
  if (differing.length === 0) return null;
  return (
    <Panel id="writers-differ" title="▲ The writers differ" testId="writers-differ" strong>
      {differing.map(({ endIndex, writers, check }) => (
        <div
          key={endIndex}
          className="space-y-2 border-b border-line pb-2"
          data-testid={`differ-end-${endIndex + 1}`}
        >
          <p className="font-bold">End {endIndex + 1}</p>
          {writers.map((w, k) => (
            <p key={k}>
              Writer {k + 1}:{' '}
              {SIDES.map((side) => (
                <span key={side} className="mr-2">
                  {nameOf(match, side)}{' '}
                  {check[side].arrows.map((x, j) => {
                    const value = k === 0 ? x.first : x.second;
                    return (
                      <span key={j} className={x.same ? '' : 'font-bold underline'}>
                        {value ?? '·'}
                        {x.same ? '' : ' (differs)'}{' '}
                      </span>
                    );
                  })}
                </span>
              ))}
            </p>
          ))}
          <div className="flex flex-wrap gap-2">
            {writers.map((w, k) => (
              <Button
                key={k}
                variant="secondary"
                onClick={() => settle({ endIndex, a: [...w.a], b: [...w.b] })}
              >
                Writer {k + 1} is right
              </Button>
            ))}
            <Button variant="secondary" onClick={() => enter(endIndex)}>
              Enter end {endIndex + 1}
            </Button>
          </div>
        </div>
      ))}
    </Panel>
  );
}
