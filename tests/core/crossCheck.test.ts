// The cross-check compares both writers' entries after sorting them highest to lowest, the
// order in which values are written (WA Book 3); two matching cards is common practice.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { crossCheck, sortEnd } from '../../src/core';
import { end, endAndReordering } from './arbitraries';

describe('crossCheck', () => {
  it('agrees on the same arrows tapped in another order', () => {
    expect(crossCheck(['9', 'X', '7'], ['7', '9', 'X'])).toEqual({
      status: 'agreed',
      arrows: [
        { index: 0, first: 'X', second: 'X', same: true },
        { index: 1, first: '9', second: '9', same: true },
        { index: 2, first: '7', second: '7', same: true },
      ],
    });
  });

  it('waits until both writers have entered the end', () => {
    expect(crossCheck(['9'], undefined)).toEqual({ status: 'waiting', arrows: [] });
    expect(crossCheck(undefined, ['9'])).toEqual({ status: 'waiting', arrows: [] });
    expect(crossCheck(undefined, undefined)).toEqual({ status: 'waiting', arrows: [] });
  });

  it('marks only the positions that differ, after sorting', () => {
    const result = crossCheck(['10', '9', '8'], ['10', '8', '8']);
    expect(result.status).toBe('mismatch');
    expect(result.arrows.map((a) => a.same)).toEqual([true, false, true]);
    expect(result.arrows[1]).toEqual({ index: 1, first: '9', second: '8', same: false });
  });

  it('treats X and 10 as different entries, since Xs decide ties', () => {
    expect(crossCheck(['X'], ['10']).status).toBe('mismatch');
  });

  it('gives a mismatch on the positions a writer left out', () => {
    const result = crossCheck(['X', '9', '9'], ['X', '9']);
    expect(result.status).toBe('mismatch');
    expect(result.arrows).toEqual([
      { index: 0, first: 'X', second: 'X', same: true },
      { index: 1, first: '9', second: '9', same: true },
      { index: 2, first: '9', same: false },
    ]);
  });

  it('agrees on two empty entries', () => {
    expect(crossCheck([], [])).toEqual({ status: 'agreed', arrows: [] });
  });

  it('agrees with itself, and with the same arrows in another order (property)', () => {
    fc.assert(
      fc.property(endAndReordering(), ([a, b]) => {
        expect(crossCheck(a, a).status).toBe('agreed');
        expect(crossCheck(a, b).status).toBe('agreed');
      }),
    );
  });

  it('gives the same status and mirrored arrows when the writers swap (property)', () => {
    fc.assert(
      fc.property(fc.option(end(6), { nil: undefined }), fc.option(end(6), { nil: undefined }), (a, b) => {
        const ab = crossCheck(a, b);
        const ba = crossCheck(b, a);
        expect(ba.status).toBe(ab.status);
        expect(ba.arrows.map((x) => [x.index, x.second, x.first, x.same])).toEqual(
          ab.arrows.map((x) => [x.index, x.first, x.second, x.same]),
        );
      }),
    );
  });

  it('agrees exactly when the sorted ends are equal (property)', () => {
    fc.assert(
      fc.property(end(6), end(6), (a, b) => {
        expect(crossCheck(a, b).status === 'agreed').toBe(
          JSON.stringify(sortEnd(a)) === JSON.stringify(sortEnd(b)),
        );
      }),
    );
  });
});
