import type { TournamentCard } from '../../../contract/myCards';
import {
  practiceProgress,
  progressChoices,
  type ProgressFilter,
  type ProgressSession,
} from '../../../core/practice/progress';
import type { ProgressPart } from '../../../core/practice/progressParts';
import { getFace } from '../../../core';
import type { PracticeSessionRow } from '../../../local/db';
import { progressSessions } from '../practiceStore';
import { tournamentProgress } from '../tournamentCards';
import { dayLabel, perArrow, weekLabel } from './progressData';

type OwnParts = readonly { session: PracticeSessionRow; parts: ProgressPart[] }[];

type Series = ReturnType<typeof practiceProgress>[number];

/** A series with its heading and its summary in words (dates formatted here, not in the tap's render). */
export type ShownSeries = { series: Series; title: string; summary: string };

export type ProgressView = {
  sessions: ProgressSession[];
  choices: ReturnType<typeof progressChoices>;
  series: ShownSeries[];
};

function shown(series: Series): ShownSeries {
  const latest = series.weeks[series.weeks.length - 1];
  const { best } = series;
  return {
    series,
    title: `${series.distanceM} m · ${getFace(series.faceId).label}`,
    summary:
      (latest
        ? `Week of ${weekLabel(latest.weekStart)}: ${perArrow(latest.averagePerArrow)} an arrow over ${latest.arrows} arrows. `
        : '') +
      `Best session: ${perArrow(best.averagePerArrow)} an arrow on ${dayLabel(best.startedAt)} (${best.arrows} arrows${best.tournament ? `, tournament: ${best.tournament}` : ''}), ringed on the chart.`,
  };
}

/**
 * What progress shows of the log's answers (useOwnSessionParts, useStoredTournamentCards), worked
 * out once per answer and filter: the log works it out while idle (warmProgressView), so the tap
 * that opens progress, and each visit after it, finds it done. The answers are shared and kept
 * (useStored): the same answer is the same object.
 */
let last: { own: OwnParts; cards: readonly TournamentCard[]; views: Map<string, ProgressView> } | undefined;

export function progressView(own: OwnParts, cards: readonly TournamentCard[], filter: ProgressFilter): ProgressView {
  if (last?.own !== own || last.cards !== cards) last = { own, cards, views: new Map() };
  const key = `${filter.bowStyle ?? ''}|${filter.distanceM ?? ''}`;
  const all = last.views.get('|');
  let view = last.views.get(key);
  if (!view) {
    const sessions = all?.sessions ?? [...progressSessions(own), ...tournamentProgress(cards)];
    view = {
      sessions,
      choices: all?.choices ?? progressChoices(sessions),
      series: practiceProgress(sessions, filter).map(shown),
    };
    last.views.set(key, view);
  }
  return view;
}
