// End states are Ringcall's own model of the double-entry practice: two cards that must agree
// before arrows are pulled (WA Book 3, scoring: archer and scorer sign; some federations require
// two matching cards), with the caller settling a difference and a judge deciding disputes.
import { describe, expect, it } from 'vitest';
import { endView } from '../../src/core';
import type { ArrowValue } from '../../src/core';

const rec = (arrows: ArrowValue[], revision = 1) => ({ arrows, revision });

describe('end states', () => {
  it('is open with no record and entered with one', () => {
    expect(endView({}).state).toBe('open');
    expect(endView({ first: rec(['X', '9', '7']) }).state).toBe('entered');
    expect(endView({ second: rec(['X', '9', '7']) }).state).toBe('entered');
  });

  it('is agreed when both writers have the same arrows in any order, and counts them sorted', () => {
    const view = endView({ first: rec(['7', 'X', '9']), second: rec(['9', '7', 'X']) });
    expect(view.state).toBe('agreed');
    expect(view.arrows).toEqual(['X', '9', '7']);
  });

  it('is a mismatch when one arrow differs, and has no counting values', () => {
    const view = endView({ first: rec(['X', '9', '7']), second: rec(['X', '8', '7']) });
    expect(view.state).toBe('mismatch');
    expect(view.arrows).toBeUndefined();
    expect(view.check.arrows.filter((a) => !a.same).map((a) => a.index)).toEqual([1]);
  });

  it('is settled by the caller while both records are the ones the caller looked at', () => {
    const facts = {
      first: rec(['X', '9', '7'], 2),
      second: rec(['X', '8', '7'], 1),
      settlement: { arrows: ['9', 'X', '7'] as ArrowValue[], disputed: [], basis: { first: 2, second: 1 } },
    };
    expect(endView(facts)).toMatchObject({
      state: 'settled',
      arrows: ['X', '9', '7'],
      settlementStale: false,
    });
    const edited = { ...facts, second: rec(['X', '6', '7'], 2) };
    expect(endView(edited)).toMatchObject({ state: 'mismatch', settlementStale: true });
  });

  it('is disputed while a judge decides, and signed whatever the records say', () => {
    const first = rec(['X', '9', '7']);
    const second = rec(['X', '8', '7']);
    const settlement = {
      arrows: ['X', '9', '7'] as ArrowValue[],
      disputed: [1],
      basis: { first: 1, second: 1 },
    };
    expect(endView({ first, second, settlement }).state).toBe('disputed');
    expect(endView({ first, second, settlement, signedArrows: ['X', '8', '7'] })).toMatchObject({
      state: 'signed',
      arrows: ['X', '8', '7'],
    });
  });
});

describe('judges and incidents (WA Book 3: only a judge may change a value once written)', () => {
  it('lets a judge ruling decide over the writers and the caller', () => {
    const view = endView({
      first: rec(['X', '9', '7']),
      second: rec(['X', '8', '7']),
      settlement: { arrows: ['X', '9', '7'], disputed: [1], basis: { first: 1, second: 1 } },
      ruling: { arrows: ['8', 'X', '7'] },
    });
    expect(view).toMatchObject({
      state: 'settled',
      arrows: ['X', '8', '7'],
      decidedBy: 'judge',
      canSign: true,
    });
  });

  it('holds signing while an incident marked on an arrow has no ruling', () => {
    const flagged = {
      arrows: ['9', '7', 'M'] as ArrowValue[],
      revision: 1,
      flags: [{ index: 2, flag: 'bounce-out' }],
    };
    const agreedWithIncident = endView({ first: flagged, second: rec(['9', '7', 'M']) });
    expect(agreedWithIncident).toMatchObject({ state: 'agreed', openIncidents: 1, canSign: false });
    const ruled = endView({
      first: flagged,
      second: rec(['9', '7', 'M']),
      ruling: { arrows: ['9', '7', '6'] },
    });
    expect(ruled).toMatchObject({ state: 'settled', openIncidents: 0, canSign: true });
  });

  it('never lets a mismatch or a dispute be signed', () => {
    expect(endView({ first: rec(['9']), second: rec(['8']) }).canSign).toBe(false);
    const disputed = endView({
      first: rec(['9']),
      second: rec(['8']),
      settlement: { arrows: ['9'], disputed: [0], basis: { first: 1, second: 1 } },
    });
    expect(disputed.canSign).toBe(false);
  });
});
