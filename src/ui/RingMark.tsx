/** Ringcall's mark: two rings and a call tick, drawn in the app's own colours. */
export function RingMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 48 48" className={className} aria-hidden="true" focusable="false">
      <circle cx="24" cy="24" r="21" fill="none" stroke="currentColor" strokeWidth="4" />
      <circle cx="24" cy="24" r="12" fill="none" stroke="currentColor" strokeWidth="4" />
      <circle cx="24" cy="24" r="4" fill="#ffe552" />
      <path
        d="M30 34 l5 5 l10 -13"
        fill="none"
        stroke="#8fd19e"
        strokeWidth="5"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
    </svg>
  );
}
