import type { SelectHTMLAttributes } from 'react';
import { LabelledControl, controlClass } from './LabelledControl';

type SelectFieldProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  hint?: string;
  error?: string | undefined;
};

/** A labelled select as large as Ringcall's inputs, with its hint and error read out too. */
export function SelectField({ label, hint, error, className, children, ...select }: SelectFieldProps) {
  return (
    <LabelledControl label={label} hint={hint} error={error} className={className}>
      {(ids) => (
        <select {...ids} className={controlClass} {...select}>
          {children}
        </select>
      )}
    </LabelledControl>
  );
}
