/** Prints each route's first load in bytes on the wire (scripts/routeSizes.ts), beside its goal. */
import { GOALS, meetsGoal, routeSizes } from './routeSizes';

const kib = (bytes: number) => `${(bytes / 1024).toFixed(1).padStart(6)} KiB`;
console.log('\nFirst load per route, bytes on the wire (shell included):');
console.log('  JavaScript and CSS        JavaScript');
console.log('     brotli        gzip     gzip  route');
for (const row of routeSizes()) {
  const goal = GOALS[row.route];
  const verdict =
    goal === undefined
      ? ''
      : `  (goal ≤ ${goal.kib} KiB gzip of ${goal.of === 'js' ? 'JavaScript' : 'everything'}: ${meetsGoal(row) ? 'met' : 'NOT met'})`;
  console.log(`  ${kib(row.br)}  ${kib(row.gz)}  ${kib(row.jsGz)}  ${row.route}${verdict}`);
}
