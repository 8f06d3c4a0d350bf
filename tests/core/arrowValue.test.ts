// Arrow values: WA Book 3, scoring chapter (values written highest to lowest, X counts 10, a miss
// is M). Refusing '0' is Ringcall's own rule, explained in src/core/arrowValue.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ARROW_VALUES,
  ScoringError,
  arrowPoints,
  compareArrowValues,
  isHit,
  isTen,
  isX,
  parseArrowValue,
} from '../../src/core';
import { arrowValue } from './arbitraries';

describe('arrow values', () => {
  it('are listed highest first, X above 10, M last (WA Book 3: values written highest to lowest)', () => {
    expect(ARROW_VALUES).toEqual(['X', '10', '9', '8', '7', '6', '5', '4', '3', '2', '1', 'M']);
  });

  it('score X as 10 and M as 0 (WA Book 3: X counts 10, a miss scores nothing)', () => {
    expect(arrowPoints('X')).toBe(10);
    expect(arrowPoints('10')).toBe(10);
    expect(arrowPoints('7')).toBe(7);
    expect(arrowPoints('1')).toBe(1);
    expect(arrowPoints('M')).toBe(0);
  });

  it('sort X before 10 and M after 1', () => {
    expect(compareArrowValues('X', '10')).toBeLessThan(0);
    expect(compareArrowValues('10', 'X')).toBeGreaterThan(0);
    expect(compareArrowValues('1', 'M')).toBeLessThan(0);
    expect(compareArrowValues('9', '9')).toBe(0);
    expect([...ARROW_VALUES].reverse().sort(compareArrowValues)).toEqual(ARROW_VALUES);
  });

  it('count Xs among the 10s for ties (WA Book 3 tie-break: 10s, X included)', () => {
    expect(ARROW_VALUES.filter(isTen)).toEqual(['X', '10']);
    expect(ARROW_VALUES.filter(isX)).toEqual(['X']);
    expect(ARROW_VALUES.filter((v) => !isHit(v))).toEqual(['M']);
  });
});

describe('parseArrowValue', () => {
  it('reads what a writer taps or types, in either case and with spaces', () => {
    expect(parseArrowValue('x')).toBe('X');
    expect(parseArrowValue('X')).toBe('X');
    expect(parseArrowValue(' 10 ')).toBe('10');
    expect(parseArrowValue('m')).toBe('M');
    expect(parseArrowValue('7\n')).toBe('7');
  });

  it('reads back every value it writes', () => {
    fc.assert(
      fc.property(arrowValue, fc.boolean(), (v, lower) => {
        expect(parseArrowValue(` ${lower ? v.toLowerCase() : v} `)).toBe(v);
      }),
    );
  });

  it('refuses 0 and asks for M, since 0 is what a 10 becomes when a digit is lost', () => {
    expect(() => parseArrowValue('0')).toThrowError(ScoringError);
    expect(() => parseArrowValue('0')).toThrowError('"0" is not an arrow value: write M for a miss.');
  });

  it.each(['', '11', 'ten', '-1', '1O', 'XX', 'miss', '9.5'])(
    'refuses %j with a message naming it',
    (bad) => {
      let caught: unknown;
      try {
        parseArrowValue(bad);
      } catch (error) {
        caught = error;
      }
      expect(caught).toBeInstanceOf(ScoringError);
      expect((caught as ScoringError).code).toBe('unknown-arrow-value');
      expect((caught as ScoringError).message).toContain(`"${bad}"`);
    },
  );
});
