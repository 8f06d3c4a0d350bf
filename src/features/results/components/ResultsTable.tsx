import type { ReactNode } from 'react';

/** Padding of every cell: tight on a phone so the counts for ties fit beside the names. */
export const CELL = 'px-1.5 py-2 sm:p-2';

/**
 * A results table in a region that scrolls sideways on a narrow screen (focusable, so a keyboard
 * can scroll it too). Numeric columns are right-aligned.
 */
export function ResultsTable({
  label,
  caption,
  columns,
  testId,
  children,
}: {
  label: string;
  caption: ReactNode;
  columns: { label: string; numeric?: boolean }[];
  testId?: string;
  children: ReactNode;
}) {
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={label}>
      <table className="w-full border-collapse text-left" data-testid={testId}>
        {caption}
        <thead>
          <tr className="border-b-2 border-ink">
            {columns.map((c) => (
              <th key={c.label} scope="col" className={`${CELL} ${c.numeric ? 'text-right' : ''}`}>
                {c.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
