import type { ArrowValue } from './arrowValue';
import { ScoringError } from './errors';

export type FaceId = 'full-122' | 'full-80' | 'sixring-80' | 'full-60' | 'full-40' | 'triple-40';
export type BowStyle = 'recurve' | 'compound' | 'barebow';
export type Venue = 'outdoor' | 'indoor';

export const FACE_IDS: readonly FaceId[] = [
  'full-122',
  'full-80',
  'sixring-80',
  'full-60',
  'full-40',
  'triple-40',
];
export const BOW_STYLES: readonly BowStyle[] = ['recurve', 'compound', 'barebow'];
export const VENUES: readonly Venue[] = ['outdoor', 'indoor'];

/** A printed scoring zone; X and M are not zones of their own. */
export type ZoneValue = Exclude<ArrowValue, 'X' | 'M'>;
export type ZoneColour = 'gold' | 'red' | 'blue' | 'black' | 'white';

export interface FaceZone {
  readonly value: ZoneValue;
  readonly outerRadiusMm: number;
  readonly colour: ZoneColour;
}

export interface Face {
  readonly id: FaceId;
  readonly label: string;
  /** Diameter of the full ten-zone face the zones come from (each spot's, on the triple face). */
  readonly diameterMm: number;
  readonly zoneWidthMm: number;
  /** Highest value first. */
  readonly zones: readonly FaceZone[];
  readonly xRadiusMm: number;
  readonly lowestZone: 1 | 5 | 6;
  readonly spots: 1 | 3;
  /**
   * Vertical offset of each spot's centre from the centre of the sheet, in mm, y growing
   * downwards as on a screen; spot 0 is the top one. [0] on single-spot faces.
   */
  readonly spotCentresMm: readonly number[];
}

const ZONE_VALUES: readonly ZoneValue[] = ['10', '9', '8', '7', '6', '5', '4', '3', '2', '1'];
// Two zones per colour from the centre out (WA Book 2, target faces).
const COLOURS: readonly ZoneColour[] = ['gold', 'red', 'blue', 'black', 'white'];

/**
 * Centre-to-centre spacing of the vertical triple 40 cm face: from memory of the WA Book 2
 * drawing (200 mm spots with about 20 mm between them); check against the edition in use.
 */
export const TRIPLE_SPOT_SPACING_MM = 220;

function buildFace(
  id: FaceId,
  label: string,
  diameterMm: number,
  lowestZone: Face['lowestZone'],
  spotCentresMm: readonly number[],
): Face {
  // WA Book 2: ten zones of equal width, diameter / 20; the inner 10 has half the 10 zone's diameter.
  const zoneWidthMm = diameterMm / 20;
  const zones = ZONE_VALUES.slice(0, 11 - lowestZone).map((value, i): FaceZone => ({
    value,
    outerRadiusMm: (i + 1) * zoneWidthMm,
    colour: COLOURS[Math.floor(i / 2)] ?? 'white',
  }));
  return {
    id,
    label,
    diameterMm,
    zoneWidthMm,
    zones,
    xRadiusMm: zoneWidthMm / 2,
    lowestZone,
    spots: spotCentresMm.length === 3 ? 3 : 1,
    spotCentresMm,
  };
}

const FACES: Readonly<Record<FaceId, Face>> = {
  'full-122': buildFace('full-122', '122 cm face', 1220, 1, [0]),
  'full-80': buildFace('full-80', '80 cm face', 800, 1, [0]),
  'sixring-80': buildFace('sixring-80', '80 cm six-ring face', 800, 5, [0]),
  'full-60': buildFace('full-60', '60 cm face', 600, 1, [0]),
  'full-40': buildFace('full-40', '40 cm face', 400, 1, [0]),
  'triple-40': buildFace('triple-40', '40 cm triple face', 400, 6, [
    -TRIPLE_SPOT_SPACING_MM,
    0,
    TRIPLE_SPOT_SPACING_MM,
  ]),
};

export function isFaceId(input: unknown): input is FaceId {
  return typeof input === 'string' && Object.hasOwn(FACES, input);
}

export function getFace(id: FaceId): Face {
  // Ids can arrive from stored or synced data, so an unknown one is refused, not trusted.
  if (!isFaceId(id)) throw new ScoringError('unknown-face', `"${String(id)}" is not a known target face.`);
  return FACES[id];
}

const INNER_TEN_FACES: ReadonlySet<FaceId> = new Set<FaceId>(['full-40', 'triple-40', 'full-60']);

/**
 * Compound indoors on the 40 cm and 60 cm faces: only the inner ring scores 10 and the rest of
 * the gold scores 9 (WA Book 3; the 60 cm face is from memory). Ringcall records that inner ring
 * as '10', never 'X', so totals and the 10s count come out right and no X is counted twice.
 */
export function scoresInnerTenOnly(faceId: FaceId, bowStyle: BowStyle, venue: Venue): boolean {
  return bowStyle === 'compound' && venue === 'indoor' && INNER_TEN_FACES.has(faceId);
}

/** The values a writer may enter for this face and bow style, highest first. */
export function scoringValues(faceId: FaceId, bowStyle: BowStyle, venue: Venue): ArrowValue[] {
  const face = getFace(faceId);
  const zoneValues = face.zones.map((z) => z.value);
  return scoresInnerTenOnly(faceId, bowStyle, venue) ? [...zoneValues, 'M'] : ['X', ...zoneValues, 'M'];
}

/** Words for messages: "the 80 cm six-ring face", "the 40 cm face for compound indoors". */
export function describeFaceFor(faceId: FaceId, bowStyle: BowStyle, venue: Venue): string {
  const label = getFace(faceId).label;
  return scoresInnerTenOnly(faceId, bowStyle, venue) ? `the ${label} for compound indoors` : `the ${label}`;
}
