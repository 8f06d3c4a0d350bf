export { countedValues, isPlotted, plotPracticeArrow } from './arrows';
export type { PlotSetup, PracticeArrow } from './arrows';
export { practiceTally } from './tally';
export type { PracticeTally } from './tally';
export { clockOf, groupStats, offsetOnSpot } from './group';
export type { GroupStats, OffsetMm } from './group';
export { practiceProgress, progressChoices, weekStartOf } from './progress';
export type { ProgressBest, ProgressFilter, ProgressSeries, ProgressSession, ProgressWeek } from './progress';
