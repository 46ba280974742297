/**
 * The convergence set: every hard circuit of test/support/hard-circuits.ts solved (or failed with
 * its expected code), with the strategy that found it, the Newton iterations and the time.
 * Run: npx tsx bench/convergence.ts [--quick] (--quick skips the circuits marked slow).
 */
import { operatingPoint, QuiescentError } from '../src/index.js';
import { HARD_CIRCUITS } from '../test/support/hard-circuits.js';

const quick = process.argv.includes('--quick');
const rows: string[][] = [['circuit', 'expected', 'outcome', 'strategy', 'iterations', 'ms']];
let wrong = 0;
for (const hard of HARD_CIRCUITS) {
  if (quick && hard.slow) continue;
  const circuit = hard.build();
  const options = hard.temperature === undefined ? {} : { temperature: hard.temperature };
  const start = performance.now();
  let outcome: string;
  let strategy = '';
  let iterations = '';
  try {
    const op = operatingPoint(circuit, options);
    outcome = 'solves';
    strategy = op.strategy;
    iterations = String(op.iterations);
  } catch (e) {
    if (!(e instanceof QuiescentError)) throw e;
    outcome = e.code;
  }
  const ms = performance.now() - start;
  if (outcome !== hard.expect) wrong++;
  rows.push([hard.name, hard.expect, outcome, strategy, iterations, ms.toFixed(1)]);
}
const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => r[c]!.length)));
for (const r of rows)
  console.log(r.map((cell, c) => (c >= 4 ? cell.padStart(widths[c]!) : cell.padEnd(widths[c]!))).join('  '));
console.log(wrong === 0 ? 'every circuit as expected' : `${wrong} circuit(s) not as expected`);
if (wrong > 0) process.exitCode = 1;
