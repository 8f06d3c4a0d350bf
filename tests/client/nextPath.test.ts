import { describe, expect, it } from 'vitest';
import { nextPath, signInThenBack } from '../../src/account/nextPath';

describe('where a sign-in sends the person next', () => {
  it('keeps a path on this site, with its query', () => {
    expect(nextPath('/pad/1/10')).toBe('/pad/1/10');
    expect(nextPath('/join?code=AB12CD')).toBe('/join?code=AB12CD');
  });

  it.each([
    ['another site', 'https://evil.example/x'],
    ['a protocol-relative address', '//evil.example/x'],
    ['a backslash the browser reads as //', '/\\evil.example'],
    ['a script address', 'javascript:alert(1)'],
    ['a relative path', 'pad/1/10'],
    ['nothing', ''],
    ['no parameter', null],
  ])('sends home instead of %s', (_, asked) => {
    expect(nextPath(asked)).toBe('/');
  });

  it('comes back from the sign-in page to the very path it was sent from, query and all', () => {
    const from = '/join?code=AB12CD&x=1 2';
    const signIn = new URL(signInThenBack(from), 'https://ringcall.example');
    expect(signIn.pathname).toBe('/sign-in');
    expect(nextPath(signIn.searchParams.get('next'))).toBe(from);
  });
});
