import { useId, type ReactNode } from 'react';

export type ControlIds = {
  id: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
};

export const controlClass =
  'surface mt-1 block min-h-14 w-full rounded-lg border-2 border-line bg-card px-3 text-lg';

/**
 * The label, hint and error around any form control, wired for screen readers; the control
 * itself is rendered by the caller with the ids it is given.
 */
export function LabelledControl({
  label,
  hint,
  error,
  className,
  children,
}: {
  label: string;
  hint?: string | undefined;
  error?: string | undefined;
  className?: string | undefined;
  children: (ids: ControlIds) => ReactNode;
}) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className={className}>
      <label htmlFor={id} className="block font-bold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-base text-ink-soft">
          {hint}
        </p>
      )}
      {children({
        id,
        'aria-invalid': error ? true : undefined,
        'aria-describedby': [hintId, errorId].filter(Boolean).join(' ') || undefined,
      })}
      {error && (
        <p id={errorId} className="mt-1 font-bold text-brick">
          <span aria-hidden="true">▲ </span>
          {error}
        </p>
      )}
    </div>
  );
}
