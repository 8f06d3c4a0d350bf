/**
 * Where a sign-in or sign-up sends the person next (`?next=`): a path on this site only. Anything
 * else (another site, `//host`, a `javascript:` address) goes home: a link shared on the field
 * must not send a person who has just signed in somewhere else, nor leave them on the form.
 */
export function nextPath(asked: string | null): string {
  if (!asked || !asked.startsWith('/') || asked.startsWith('//') || asked.startsWith('/\\')) return '/';
  return asked;
}

/** The sign-in page, which brings the person back to `path` (a path on this site) once signed in. */
export const signInThenBack = (path: string): string => `/sign-in?next=${encodeURIComponent(path)}`;
