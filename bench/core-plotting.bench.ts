/**
 * Plotted-arrow scoring throughput: 1,000,000 random positions on the 122 cm face and on the
 * 40 cm triple face. Prints median time and arrows per second; asserts nothing.
 */
import { arrowPoints, getFace } from '../src/core';
import { scorePlottedArrow } from '../src/core/plotting';
import type { BowStyle, FaceId, Venue } from '../src/core';

const ARROWS = 1_000_000;
const RUNS = 5;

function mulberry32(seed: number): () => number {
  let a = seed;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function median(samples: number[]): number {
  const sorted = [...samples].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? Number.NaN;
}

function bench(label: string, faceId: FaceId, bowStyle: BowStyle, venue: Venue): void {
  const face = getFace(faceId);
  // Positions over the whole sheet, a little beyond the scoring zones, so misses are included.
  const halfWidth = (face.zones.at(-1)?.outerRadiusMm ?? 0) * 1.1;
  const halfHeight = halfWidth + Math.max(...face.spotCentresMm);
  const random = mulberry32(18);
  const xs = Float64Array.from({ length: ARROWS }, () => (random() * 2 - 1) * halfWidth);
  const ys = Float64Array.from({ length: ARROWS }, () => (random() * 2 - 1) * halfHeight);

  const times: number[] = [];
  let points = 0;
  for (let run = 0; run < RUNS + 1; run += 1) {
    points = 0;
    const start = performance.now();
    for (let i = 0; i < ARROWS; i += 1) {
      const { value } = scorePlottedArrow({
        xMm: xs[i] ?? 0,
        yMm: ys[i] ?? 0,
        shaftDiameterMm: 5,
        faceId,
        bowStyle,
        venue,
      });
      points += arrowPoints(value);
    }
    // The first run warms the JIT and is not counted.
    if (run > 0) times.push(performance.now() - start);
  }
  const ms = median(times);
  const perSecond = Math.round(ARROWS / (ms / 1000)).toLocaleString('en-GB');
  console.log(
    `${label}: ${ms.toFixed(1)} ms for ${ARROWS.toLocaleString('en-GB')} arrows, ${perSecond} arrows/s`,
  );
  console.log(`  (average ${(points / ARROWS).toFixed(3)} points an arrow; median of ${RUNS} runs)`);
}

bench('122 cm face, recurve outdoors', 'full-122', 'recurve', 'outdoor');
bench('40 cm triple face, compound indoors', 'triple-40', 'compound', 'indoor');
