import { Field } from './Field';

/** A join code as typed from a sheet: large, upper case, no autocorrect (a target's or a match's). */
export function JoinCodeField({
  label,
  hint,
  code,
  setCode,
}: {
  label: string;
  hint: string;
  code: string;
  setCode: (code: string) => void;
}) {
  return (
    <Field
      label={label}
      hint={hint}
      value={code}
      onChange={(e) => setCode(e.target.value.toUpperCase())}
      autoCapitalize="characters"
      autoComplete="off"
      spellCheck={false}
      className="[&_input]:text-3xl [&_input]:tracking-[0.3em]"
    />
  );
}
