// Both practice screens in one chunk: what only practice uses (plotting, group statistics) then
// stays in it instead of joining a chunk the pad shares.
export { PracticeScreen } from './PracticeScreen';
export { PracticeSessionScreen } from './PracticeSessionScreen';
