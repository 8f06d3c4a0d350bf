import { describe, expect, it } from 'vitest';
import { addArrow, changeArrow, flagArrow, removeArrow } from '../../src/features/pad/endEdits';

describe('editing an end on the pad', () => {
  it('keeps values highest to lowest as they are tapped (WA Book 3: values are written highest to lowest)', () => {
    let end = { arrows: [], flags: [] } as Parameters<typeof addArrow>[0];
    for (const v of ['7', 'X', 'M', '10'] as const) end = addArrow(end, v);
    expect(end.arrows).toEqual(['X', '10', '7', 'M']);
  });

  it('keeps a flag on the arrow it was put on when later values sort in front of it', () => {
    let end = addArrow({ arrows: [], flags: [] }, '7');
    end = flagArrow(end, 0, 'bounce-out');
    end = addArrow(end, '9');
    expect(end).toEqual({ arrows: ['9', '7'], flags: [{ index: 1, flag: 'bounce-out' }] });
    end = changeArrow(end, 1, 'X');
    expect(end).toEqual({ arrows: ['X', '9'], flags: [{ index: 0, flag: 'bounce-out' }] });
    end = removeArrow(end, 0);
    expect(end).toEqual({ arrows: ['9'], flags: [] });
  });

  it('clears a flag', () => {
    const end = flagArrow(flagArrow({ arrows: ['9'], flags: [] }, 0, 'hanging'), 0, undefined);
    expect(end.flags).toEqual([]);
  });
});
