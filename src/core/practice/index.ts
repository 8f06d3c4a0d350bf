export { countedValues, isPlotted, plotPracticeArrow } from './arrows';
export type { PlotSetup, PracticeArrow } from './arrows';
export { practiceTally } from './tally';
export type { PracticeTally } from './tally';
export { clockOf, groupStats, offsetOnSpot } from './group';
export type { GroupStats, OffsetMm } from './group';
// Progress (./progress) is imported from its own file: only the progress screen's chunk needs it.
