import type { ArrowValue } from '../arrowValue';
import type { BowStyle, FaceId, Venue } from '../faces';
import { oneArrowPerSpot, scorePlottedArrow } from '../plotting';

/** One practice arrow: a value typed on the keys, or a plotted point with the value it scores. */
export interface PracticeArrow {
  value: ArrowValue;
  /** Where it hit, in mm from the centre of the sheet (plotted arrows only). */
  xMm?: number;
  yMm?: number;
  /** Triple face: the spot hit (see scorePlottedArrow). */
  spot?: number;
}

/** What the plotting rule needs about the arrows and the face they were shot at. */
export interface PlotSetup {
  faceId: FaceId;
  bowStyle: BowStyle;
  venue: Venue;
  shaftDiameterMm: number;
}

/** A plotted practice arrow, scored by the core's plotting rule (a line touch scores the higher zone). */
export function plotPracticeArrow(setup: PlotSetup, xMm: number, yMm: number): PracticeArrow {
  const { value, spot } = scorePlottedArrow({ ...setup, xMm, yMm });
  return spot === undefined ? { value, xMm, yMm } : { value, xMm, yMm, spot };
}

/**
 * The values an end's arrows count for: on the triple face only one arrow a spot counts (the
 * plotting rule's oneArrowPerSpot); typed arrows count as typed.
 */
export function countedValues(arrows: readonly PracticeArrow[]): ArrowValue[] {
  return oneArrowPerSpot(arrows);
}

/** Whether an arrow was plotted (it has a point on the face). */
export function isPlotted(arrow: PracticeArrow): arrow is PracticeArrow & { xMm: number; yMm: number } {
  return typeof arrow.xMm === 'number' && typeof arrow.yMm === 'number';
}
