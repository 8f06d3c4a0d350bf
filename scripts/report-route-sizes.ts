/** Prints each route's first load in bytes on the wire (scripts/routeSizes.ts), beside its goal. */
import { GOALS, routeSizes } from './routeSizes';

const kib = (bytes: number) => `${(bytes / 1024).toFixed(1).padStart(6)} KiB`;
console.log('\nFirst load per route, bytes on the wire (JavaScript and CSS, shell included):');
console.log('     brotli        gzip  route');
for (const row of routeSizes()) {
  const goal = GOALS[row.route];
  const verdict =
    goal === undefined ? '' : `  (goal ≤ ${goal} KiB gzip: ${row.gz <= goal * 1024 ? 'met' : 'NOT met'})`;
  console.log(`  ${kib(row.br)}  ${kib(row.gz)}  ${row.route}${verdict}`);
}
