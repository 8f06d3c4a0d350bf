/**
 * Standings for a large field: card totals for 1,000 archers with 72 random arrows each on the
 * 70 m round, then the ranking with a cut. Prints median times; asserts nothing.
 */
import { ARROW_VALUES, cardTotals, getRound } from '../src/core';
import { rankArchers } from '../src/core/ranking';
import type { ArrowValue } from '../src/core';

const ARCHERS = 1_000;
const RUNS = 15;
const round = getRound('70m');

// Seeded generator so every run measures the same field.
function mulberry32(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const random = mulberry32(1440);
// Values skewed towards the gold, with narrow totals so that ties actually occur.
const pick = (): ArrowValue =>
  ARROW_VALUES[Math.min(ARROW_VALUES.length - 1, Math.floor(random() ** 2 * 6))] ?? 'M';
const cards: ArrowValue[][][] = Array.from({ length: ARCHERS }, () =>
  Array.from({ length: 12 }, () => Array.from({ length: 6 }, pick)),
);

function median(samples: number[]): number {
  const sorted = [...samples].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? Number.NaN;
}

const totalsMs: number[] = [];
const rankMs: number[] = [];
let ties = 0;
for (let run = 0; run < RUNS + 2; run += 1) {
  const t0 = performance.now();
  const rows = cards.map((ends, i) => {
    const card = cardTotals(round, ends);
    return { id: `archer-${i}`, total: card.total, tens: card.tens, xs: card.xs, nines: card.nines };
  });
  const t1 = performance.now();
  const ranked = rankArchers(rows, { cut: 104 });
  const t2 = performance.now();
  ties = ranked.filter((r) => r.tied).length;
  // The first two runs warm the JIT and are not counted.
  if (run >= 2) {
    totalsMs.push(t1 - t0);
    rankMs.push(t2 - t1);
  }
}

const both = totalsMs.map((t, i) => t + (rankMs[i] ?? 0));
console.log(`ranking ${ARCHERS} archers × 72 arrows, median of ${RUNS} runs (${ties} archers in ties)`);
console.log(`  card totals: ${median(totalsMs).toFixed(2)} ms`);
console.log(`  ranking:     ${median(rankMs).toFixed(2)} ms`);
console.log(`  together:    ${median(both).toFixed(2)} ms`);
