import { signUpSchema, type SignUpInput } from '../contract/auth';
import { Field } from '../ui/Field';

export type AccountForm = { displayName: string; email: string; password: string };
export const emptyAccount: AccountForm = { displayName: '', email: '', password: '' };
export type AccountProblems = Partial<Record<keyof AccountForm, string>>;

/** Checks a new account's fields with the contract's rules: the input to send, or what to fix. */
export function checkAccount(
  form: AccountForm,
  inviteToken?: string,
): { input: SignUpInput; problems?: undefined } | { input?: undefined; problems: AccountProblems } {
  const parsed = signUpSchema.safeParse({ ...form, ...(inviteToken ? { inviteToken } : {}) });
  if (parsed.success) return { input: parsed.data };
  return { problems: Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])) };
}

/** Name, e-mail and password of a new account: all it takes to start. */
export function AccountFields({
  form,
  onChange,
  problems,
}: {
  form: AccountForm;
  onChange: (next: AccountForm) => void;
  problems: AccountProblems;
}) {
  const set = (key: keyof AccountForm) => (e: { target: { value: string } }) =>
    onChange({ ...form, [key]: e.target.value });
  return (
    <>
      <Field
        label="Your name"
        hint="As it should appear on scorecards."
        autoComplete="name"
        value={form.displayName}
        onChange={set('displayName')}
        error={problems.displayName}
      />
      <Field
        label="E-mail"
        type="email"
        autoComplete="email"
        value={form.email}
        onChange={set('email')}
        error={problems.email}
      />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={PASSWORD_HINT}
        value={form.password}
        onChange={set('password')}
        error={problems.password}
      />
    </>
  );
}

export const PASSWORD_HINT =
  'At least 8 characters, at most 72 bytes (about 72 letters). A short sentence works well.';

/** A link a person must tap: at least 44 px tall, like every other target. */
export const tapLinkClass = 'inline-flex min-h-11 items-center font-bold underline';
