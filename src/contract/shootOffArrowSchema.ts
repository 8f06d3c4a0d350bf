import { z } from 'zod';
import { arrowValueSchema } from './arrowValueSchema';

/** The fields of one shoot-off arrow, at the cut (results) or in a match. */
export const shootOffArrowFields = {
  value: arrowValueSchema,
  /** Measured distance of the arrow from the centre, in mm. */
  distanceMm: z.number().min(0, 'A distance from the centre cannot be below 0 mm.').max(1000).optional(),
  /** The judge saw this arrow closer to the centre than the others of equal value. */
  closer: z.boolean().default(false),
};

/** A judge gives either a measurement or "closer" for an arrow, never both. */
export const oneMeasure: [
  (a: { closer: boolean; distanceMm?: number | undefined }) => boolean,
  { message: string; path: string[] },
] = [
  (a) => !(a.closer && a.distanceMm !== undefined),
  { message: 'Give either the measured distance or "closer", not both.', path: ['closer'] },
];
