import type { BowStyle, FaceId } from '../faces';
import type { ProgressPart } from './progressParts';

export { progressParts } from './progressParts';
export type { ProgressPart } from './progressParts';

/** What progress needs of a practice session: when, which bow, and its parts as shot. */
export interface ProgressSession {
  id: string;
  /** ISO 8601 UTC. */
  startedAt: string;
  bowStyle: BowStyle;
  parts: readonly ProgressPart[];
  /** A tournament card rather than practice: its event and session, in words. */
  tournament?: string;
}

/** Absent: every bow style / every distance. */
export interface ProgressFilter {
  bowStyle?: BowStyle;
  distanceM?: number;
}

/** One week's arrows at one distance and face. */
export interface ProgressWeek {
  /** The Monday the week starts on (UTC), YYYY-MM-DD. */
  weekStart: string;
  sessions: number;
  arrows: number;
  total: number;
  averagePerArrow: number;
  /** Tournament cards among the week's sessions (absent when none). */
  tournaments?: number;
}

/** The session with the highest average per arrow at this distance and face. */
export interface ProgressBest {
  sessionId: string;
  startedAt: string;
  weekStart: string;
  arrows: number;
  averagePerArrow: number;
  /** When the best session is a tournament card: its event and session. */
  tournament?: string;
}

/** Progress at one distance and face, weeks oldest first (weeks with no practice left out). */
export interface ProgressSeries {
  distanceM: number;
  faceId: FaceId;
  weeks: ProgressWeek[];
  best: ProgressBest;
}

const DAY_MS = 86_400_000;

/** The Monday (UTC) of the week an instant falls in, as YYYY-MM-DD (weeks run Monday to Sunday, ISO 8601). */
export function weekStartOf(iso: string): string {
  const day = Math.floor(Date.parse(iso) / DAY_MS);
  // 1970-01-01 (day 0) was a Thursday: days since the last Monday = (day + 3) mod 7.
  const monday = day - ((((day + 3) % 7) + 7) % 7);
  return new Date(monday * DAY_MS).toISOString().slice(0, 10);
}

/** The bow styles and distances that occur, for the filters (distances shortest first). */
export function progressChoices(sessions: readonly ProgressSession[]): {
  bowStyles: BowStyle[];
  distances: number[];
} {
  const bowStyles = new Set<BowStyle>();
  const distances = new Set<number>();
  for (const s of sessions) {
    bowStyles.add(s.bowStyle);
    for (const p of s.parts) if (p.arrows > 0) distances.add(p.distanceM);
  }
  return { bowStyles: [...bowStyles], distances: [...distances].sort((a, b) => a - b) };
}

type Running = { sessions: Set<string>; tournaments: Set<string>; arrows: number; total: number };
type SessionPart = { session: ProgressSession; arrows: number; total: number };

/**
 * Average per arrow per week, one series per distance and face (shortest distance first), after
 * the filters (parts from progressParts). The best session is the one
 * with the highest average per arrow in the series; a tie goes to the one with more arrows, then
 * to the earlier one.
 */
export function practiceProgress(
  sessions: readonly ProgressSession[],
  filter: ProgressFilter = {},
): ProgressSeries[] {
  const groups = new Map<
    string,
    { distanceM: number; faceId: FaceId; weeks: Map<string, Running>; parts: Map<string, SessionPart> }
  >();
  for (const session of sessions) {
    if (filter.bowStyle !== undefined && session.bowStyle !== filter.bowStyle) continue;
    const week = weekStartOf(session.startedAt);
    for (const shot of session.parts) {
      if (shot.arrows === 0) continue;
      if (filter.distanceM !== undefined && shot.distanceM !== filter.distanceM) continue;
      const key = `${shot.distanceM}|${shot.faceId}`;
      let group = groups.get(key);
      if (!group) {
        group = { distanceM: shot.distanceM, faceId: shot.faceId, weeks: new Map(), parts: new Map() };
        groups.set(key, group);
      }
      const total = shot.points;
      const arrows = shot.arrows;
      let running = group.weeks.get(week);
      if (!running) {
        running = { sessions: new Set(), tournaments: new Set(), arrows: 0, total: 0 };
        group.weeks.set(week, running);
      }
      running.sessions.add(session.id);
      if (session.tournament !== undefined) running.tournaments.add(session.id);
      running.arrows += arrows;
      running.total += total;
      let part = group.parts.get(session.id);
      if (!part) {
        part = { session, arrows: 0, total: 0 };
        group.parts.set(session.id, part);
      }
      part.arrows += arrows;
      part.total += total;
    }
  }
  const series: ProgressSeries[] = [];
  for (const group of groups.values()) {
    const weeks = [...group.weeks.entries()]
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([weekStart, r]) => ({
        weekStart,
        sessions: r.sessions.size,
        arrows: r.arrows,
        total: r.total,
        averagePerArrow: r.total / r.arrows,
        ...(r.tournaments.size > 0 ? { tournaments: r.tournaments.size } : {}),
      }));
    let best: SessionPart | undefined;
    for (const part of group.parts.values()) {
      if (!best || isBetter(part, best)) best = part;
    }
    if (!best) continue;
    series.push({
      distanceM: group.distanceM,
      faceId: group.faceId,
      weeks,
      best: {
        sessionId: best.session.id,
        startedAt: best.session.startedAt,
        weekStart: weekStartOf(best.session.startedAt),
        arrows: best.arrows,
        averagePerArrow: best.total / best.arrows,
        ...(best.session.tournament !== undefined ? { tournament: best.session.tournament } : {}),
      },
    });
  }
  return series.sort((a, b) => a.distanceM - b.distanceM || a.faceId.localeCompare(b.faceId));
}

function isBetter(a: SessionPart, b: SessionPart): boolean {
  // Compared as fractions (a.total/a.arrows vs b.total/b.arrows) so equal averages tie exactly.
  const diff = a.total * b.arrows - b.total * a.arrows;
  if (diff !== 0) return diff > 0;
  if (a.arrows !== b.arrows) return a.arrows > b.arrows;
  return a.session.startedAt < b.session.startedAt;
}
