/**
 * The usual range cautions, calm and short, shown where scoring happens. Never a blocking dialog.
 * The event's judges and the governing body's rules always decide.
 */
export function SafetyNote({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      aria-label="Range safety"
      className="surface rounded-xl border-2 border-caution-ink/30 bg-caution-bg p-4 text-caution-ink"
    >
      <p className="font-bold">
        <span aria-hidden="true">⚠ </span>Range safety first
      </p>
      {compact ? (
        <p>
          Go forward only on the signal. No phone on the shooting line. Score before anyone touches an arrow.
        </p>
      ) : (
        <ul className="mt-1 list-disc space-y-1 pl-5">
          <li>Go forward to the target only when the signal says shooting has stopped.</li>
          <li>Keep your phone away while you are on the shooting line.</li>
          <li>Don't touch arrows or the face until every arrow is scored and the holes are marked.</li>
          <li>Stand aside when arrows are pulled.</li>
        </ul>
      )}
      <p className="mt-2 text-base">The event's judges and the governing body's rules always decide.</p>
    </aside>
  );
}
