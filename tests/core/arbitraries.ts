// Shared fast-check generators for the core tests.
import fc from 'fast-check';
import { ARROW_VALUES } from '../../src/core';
import type { ArrowValue } from '../../src/core';

export const arrowValue: fc.Arbitrary<ArrowValue> = fc.constantFrom(...ARROW_VALUES);

export const end = (maxLength = 12): fc.Arbitrary<ArrowValue[]> => fc.array(arrowValue, { maxLength });

/** An end together with the same arrows tapped in another order. */
export const endAndReordering = (maxLength = 12): fc.Arbitrary<[ArrowValue[], ArrowValue[]]> =>
  end(maxLength).chain((values) =>
    fc.tuple(
      fc.constant(values),
      fc.shuffledSubarray(values, { minLength: values.length, maxLength: values.length }),
    ),
  );
