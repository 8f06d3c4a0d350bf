import { counted } from '../../../ui/counted';

/** "1 archer on 1 target", "12 archers on 3 targets": how far a session's target assignment is. */
export function archersOnTargets(archers: number, targets: number): string {
  return `${counted(archers, 'archer')} on ${counted(targets, 'target')}`;
}
