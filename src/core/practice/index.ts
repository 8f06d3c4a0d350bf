export { countedValues, isPlotted, plotPracticeArrow } from './arrows';
export type { PlotSetup, PracticeArrow } from './arrows';
export { practiceTally } from './tally';
export type { PracticeTally } from './tally';
export { clockOf, groupStats, offsetOnSpot } from './group';
export type { GroupStats, OffsetMm } from './group';
