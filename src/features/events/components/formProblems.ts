import type { z } from 'zod';

/** The first problem of each field, keyed by its top-level name, for showing under inputs. */
export function formProblems(error: z.ZodError): Record<string, string> {
  const problems: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? String(issue.path[0]) : 'form';
    problems[key] ??= issue.message;
  }
  return problems;
}

export const BOW_STYLE_LABELS = { recurve: 'Recurve', compound: 'Compound', barebow: 'Barebow' } as const;

/** "12 Dec 2026" or "12–13 Dec 2026", in the browser's language. */
export function dateRange(startsOn: string, endsOn: string): string {
  const format = (d: string) =>
    new Date(`${d}T12:00:00Z`).toLocaleDateString(undefined, {
      day: 'numeric',
      month: 'short',
      year: 'numeric',
      timeZone: 'UTC',
    });
  return startsOn === endsOn ? format(startsOn) : `${format(startsOn)} – ${format(endsOn)}`;
}

/** Keeps a number with its unit on one line: "70 m round" never breaks between 70 and m. */
export const keepUnits = (text: string): string => text.replace(/(\d) (m|cm)\b/g, '$1\u00a0$2');
