/**
 * `npm run bench:lu -- --matrix FILE.mtx [--repeat N]`: reads a coordinate Matrix Market file (real
 * or complex) and prints one JSON line {"n","nnz","nnzLU","factorMs","refactorMs","solveMs","residual"}
 * with the median times of the sparse LU solver (see lu-timing.ts).
 */
import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { parseMatrixMarket } from '../src/linalg/index.js';
import { timeSparseLu } from './lu-timing.js';

const { values } = parseArgs({
  options: { matrix: { type: 'string' }, repeat: { type: 'string', default: '11' } },
});
if (values.matrix === undefined) {
  process.stderr.write('usage: npm run bench:lu -- --matrix FILE.mtx [--repeat N]\n');
  process.exit(2);
}
const repeat = Math.max(1, Number.parseInt(values.repeat, 10) || 11);
const file = parseMatrixMarket(readFileSync(values.matrix, 'utf8'));
const timing = timeSparseLu({ name: values.matrix, pattern: file.pattern, Ax: file.Ax, Az: file.Az }, repeat);
process.stdout.write(`${JSON.stringify(timing)}\n`);
