import type { ArrowValue } from '../../core';

/**
 * Values drawn in the standard face colours (the sport's own code), with text that keeps
 * at least 7:1 contrast on each.
 */
export function arrowLook(value: ArrowValue): string {
  switch (value) {
    case 'X':
    case '10':
    case '9':
      return 'bg-face-gold text-black';
    case '8':
    case '7':
      return 'bg-face-red text-black';
    case '6':
    case '5':
      return 'bg-face-blue text-black';
    case '4':
    case '3':
      return 'bg-face-black text-white';
    case '2':
    case '1':
      return 'bg-face-white text-black border-2 border-neutral-500';
    case 'M':
      return 'bg-neutral-300 text-black';
  }
}
