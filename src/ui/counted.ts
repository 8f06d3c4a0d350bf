/** "1 archer", "3 archers": a count with its noun in the right number (English plurals with -s). */
export function counted(n: number, noun: string, plural = `${noun}s`): string {
  return `${n} ${n === 1 ? noun : plural}`;
}
