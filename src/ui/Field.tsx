import { useId, type InputHTMLAttributes } from 'react';

type FieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; hint?: string; error?: string | undefined };

/** A labelled input, large enough for gloved fingers, with its hint and error read out too. */
export function Field({ label, hint, error, className, ...input }: FieldProps) {
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
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className="surface mt-1 block min-h-14 w-full rounded-lg border-2 border-line bg-card px-3 text-lg"
        {...input}
      />
      {error && (
        <p id={errorId} className="mt-1 font-bold text-brick">
          <span aria-hidden="true">▲ </span>
          {error}
        </p>
      )}
    </div>
  );
}
