import type { InputHTMLAttributes } from 'react';
import { LabelledControl, controlClass } from './LabelledControl';

type FieldProps = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  hint?: string;
  error?: string | undefined;
};

/** A labelled input, large enough for gloved fingers, with its hint and error read out too. */
export function Field({ label, hint, error, className, ...input }: FieldProps) {
  return (
    <LabelledControl label={label} hint={hint} error={error} className={className}>
      {(ids) => <input {...ids} className={controlClass} {...input} />}
    </LabelledControl>
  );
}
