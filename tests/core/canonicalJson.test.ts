// Canonical JSON for hashing signed cards. Sorting keys by UTF-16 code units with no whitespace
// follows the idea of RFC 8785 (JSON Canonicalization Scheme); the refusals are Ringcall's own rule.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ScoringError, canonicalJson } from '../../src/core';

function refusal(value: unknown): string {
  try {
    canonicalJson(value);
  } catch (error) {
    expect(error).toBeInstanceOf(ScoringError);
    expect((error as ScoringError).code).toBe('not-canonical-json');
    return (error as ScoringError).message;
  }
  throw new Error('expected the value to be refused');
}

describe('canonicalJson', () => {
  it('sorts keys at every level and writes no whitespace', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, { z: true, y: null }], c: 'x' } })).toBe(
      '{"a":{"c":"x","d":[3,{"y":null,"z":true}]},"b":1}',
    );
  });

  it('writes the same text whatever order the keys were added in', () => {
    const card = { archer: 'A-12', ends: [['X', '10', '9']], total: 29 };
    const sameCard = { total: 29, ends: [['X', '10', '9']], archer: 'A-12' };
    expect(canonicalJson(sameCard)).toBe(canonicalJson(card));
  });

  it('sorts keys by UTF-16 code units', () => {
    expect(canonicalJson({ é: 1, z: 2, Z: 3, '😀': 4, '\uffff': 5, '10': 6, '9': 7 })).toBe(
      '{"10":6,"9":7,"Z":3,"z":2,"é":1,"😀":4,"\uffff":5}',
    );
  });

  it('writes strings, numbers and literals as JSON does', () => {
    expect(canonicalJson(['a"b\n', -0, 1e21, 0.1, false, null])).toBe('["a\\"b\\n",0,1e+21,0.1,false,null]');
  });

  it('accepts objects without a prototype and shared, non-circular references', () => {
    const shared = { v: 1 };
    const bare = Object.assign(Object.create(null) as Record<string, unknown>, { b: shared, a: shared });
    expect(canonicalJson(bare)).toBe('{"a":{"v":1},"b":{"v":1}}');
  });

  it('refuses what JSON would drop or bend, naming where it is', () => {
    expect(refusal({ a: undefined })).toBe('Cannot sign $.a: undefined has no JSON form.');
    expect(refusal([1, Number.NaN])).toBe('Cannot sign $[1]: NaN is not a JSON number.');
    expect(refusal({ t: Number.POSITIVE_INFINITY })).toBe('Cannot sign $.t: Infinity is not a JSON number.');
    expect(refusal({ t: Number.NEGATIVE_INFINITY })).toContain('-Infinity');
    expect(refusal({ f: () => 1 })).toBe('Cannot sign $.f: function has no JSON form.');
    expect(refusal(Symbol('s'))).toBe('Cannot sign $: symbol has no JSON form.');
    expect(refusal(10n)).toBe('Cannot sign $: bigint has no JSON form.');
    expect(refusal(undefined)).toBe('Cannot sign $: undefined has no JSON form.');
    expect(refusal({ at: new Date(0) })).toBe(
      'Cannot sign $.at: a Date is not plain data; convert it first (a Date to an ISO string).',
    );
    expect(refusal(new Map())).toContain('a Map is not plain data');
    // eslint-disable-next-line no-sparse-arrays
    expect(refusal([1, , 3])).toBe('Cannot sign $[1]: undefined has no JSON form.');
  });

  it('refuses a value that contains itself', () => {
    const loop: Record<string, unknown> = { a: 1 };
    loop.self = loop;
    expect(refusal(loop)).toBe('Cannot sign $.self: it contains itself.');
  });

  it('reads back to the same value and is stable under a round trip (property)', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        const text = canonicalJson(value);
        expect(canonicalJson(JSON.parse(text))).toBe(text);
        expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(value)));
      }),
    );
  });

  it('does not depend on key insertion order (property)', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.jsonValue()), (record) => {
        const reversed = Object.fromEntries(Object.entries(record).reverse());
        expect(canonicalJson(reversed)).toBe(canonicalJson(record));
      }),
    );
  });
});
