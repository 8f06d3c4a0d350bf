import type { InputHTMLAttributes } from 'react';
import { LabelledControl } from './LabelledControl';

type FileFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & {
  label: string;
  hint?: string | undefined;
  error?: string | undefined;
};

/** A labelled file chooser, tall enough to tap, with its hint and error read out too. */
export function FileField({ label, hint, error, className, ...input }: FileFieldProps) {
  return (
    <LabelledControl label={label} hint={hint} error={error} className={className}>
      {(ids) => <input {...ids} type="file" className="mt-1 block min-h-14 w-full text-base" {...input} />}
    </LabelledControl>
  );
}

/** What a photo of a target or a paper card may be; phones open the back camera for it. */
export const photoInput = { accept: 'image/jpeg,image/png,image/webp', capture: 'environment' } as const;
