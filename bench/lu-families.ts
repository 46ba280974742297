/**
 * The sparse LU on circuit-shaped families (circuit-matrices.ts), real and complex, at about 1k,
 * 10k and 100k unknowns: median fresh factorization, refactorization and solve times, fill, the
 * relative residual, the dense ml-matrix factorization time where it stays under a few seconds,
 * and the growth exponent of factor time with n. Every matrix is also written to
 * bench/out/<name>.mtx; when the KLU harness has been built (make -C bench/klu) it is run on the
 * same files and its figures are printed beside ours.
 *
 * Usage: npm run bench:lu-families [-- --sizes 1000,10000,100000] [--rounds R] [--no-klu]
 * (--rounds alternates ours and KLU R times on each matrix and reports the medians, which steadies
 * the comparison on a busy machine).
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { LuDecomposition, Matrix } from 'ml-matrix';
import { formatMatrixMarket } from '../src/linalg/index.js';
import { type CircuitMatrix, FAMILIES, familyMatrix } from './circuit-matrices.js';
import { type LuTiming, median, timeSparseLu } from './lu-timing.js';

const here = dirname(fileURLToPath(import.meta.url));
const outDir = join(here, 'out');
const kluBinary = join(here, 'klu', 'build', 'klu-bench');

/** Dense factorizations are skipped once the predicted time passes this (n³ growth). */
const DENSE_BUDGET_MS = 4000;
/**
 * Largest dense order tried: ml-matrix took about 2 s at order 1,000 and 10 s at 2,000 (the real
 * form of a complex matrix of order 1,000) on the 2-core test machine, so only the real matrices
 * of the smallest size are factored densely by default.
 */
const DENSE_MAX_ORDER = 1100;

interface Row {
  readonly name: string;
  readonly family: string;
  readonly complex: boolean;
  readonly ours: LuTiming;
  readonly klu: LuTiming | null;
  readonly denseMs: number | null;
}

/** Time ml-matrix's dense LU on M (complex through the real form [[Ar, −Ai], [Ai, Ar]]). */
function timeDense(M: CircuitMatrix): number {
  const { n, Ap, Ai } = M.pattern;
  const m = M.Az === null ? n : 2 * n;
  const D = Matrix.zeros(m, m);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const i = Ai[p]!;
      D.set(i, j, M.Ax[p]!);
      if (M.Az !== null) {
        D.set(i + n, j + n, M.Ax[p]!);
        D.set(i, j + n, -M.Az[p]!);
        D.set(i + n, j, M.Az[p]!);
      }
    }
  }
  const t0 = performance.now();
  const lu = new LuDecomposition(D);
  const ms = performance.now() - t0;
  if (lu.isSingular()) throw new Error(`${M.name}: dense LU found the matrix singular`);
  return ms;
}

function runKlu(file: string, repeat: number): LuTiming | null {
  if (!existsSync(kluBinary)) return null;
  const out = execFileSync(kluBinary, [file, String(repeat)], { encoding: 'utf8' });
  return JSON.parse(out) as LuTiming;
}

/** Figure by figure, the median over several runs on the same matrix. */
function medianTiming(runs: readonly LuTiming[]): LuTiming {
  const pick = (key: 'factorMs' | 'refactorMs' | 'solveMs'): number => median(runs.map((r) => r[key]));
  return {
    ...runs[0]!,
    factorMs: pick('factorMs'),
    refactorMs: pick('refactorMs'),
    solveMs: pick('solveMs'),
  };
}

/** Least-squares slope of log(time) against log(n). */
function growthExponent(points: readonly { n: number; ms: number }[]): number {
  const xs = points.map((p) => Math.log(p.n));
  const ys = points.map((p) => Math.log(p.ms));
  const mx = xs.reduce((a, b) => a + b, 0) / xs.length;
  const my = ys.reduce((a, b) => a + b, 0) / ys.length;
  let sxy = 0;
  let sxx = 0;
  for (let k = 0; k < xs.length; k++) {
    sxy += (xs[k]! - mx) * (ys[k]! - my);
    sxx += (xs[k]! - mx) ** 2;
  }
  return sxy / sxx;
}

const fmt = (v: number | null | undefined, digits = 3): string =>
  v === null || v === undefined ? '—' : Number(v.toPrecision(digits)).toString();

/** Run the families and print the table; returns the rows. */
export function runLuFamilies(argv: string[] = []): Row[] {
  const { values } = parseArgs({
    args: argv,
    options: {
      sizes: { type: 'string', default: '1000,10000,100000' },
      rounds: { type: 'string', default: '1' },
      'no-klu': { type: 'boolean' },
    },
  });
  const sizes = values.sizes.split(',').map(Number);
  const useKlu = values['no-klu'] !== true;
  const rounds = Math.max(1, Number.parseInt(values.rounds, 10) || 1);
  mkdirSync(outDir, { recursive: true });
  const rows: Row[] = [];
  const lines: string[] = [
    '| matrix | n | nnz | nnz(L+U) | factor ms | refactor ms | solve ms | residual | KLU nnz(L+U) | KLU factor | KLU refactor | KLU solve | factor ×KLU | refactor ×KLU | dense ms |',
    '|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|',
  ];
  const exponents: string[] = [];
  // Warm the JIT on both kernels first, so that the first small matrix is not timed cold.
  timeSparseLu(familyMatrix('stages', 2000, false), 5);
  timeSparseLu(familyMatrix('stages', 2000, true), 5);
  for (const family of FAMILIES) {
    for (const complex of [false, true]) {
      const points: { n: number; ms: number }[] = [];
      const kluPoints: { n: number; ms: number }[] = [];
      for (const size of sizes) {
        const M = familyMatrix(family, size, complex);
        const n = M.pattern.n;
        const repeat = n <= 20000 ? 21 : 5;
        const file = join(outDir, `${M.name}.mtx`);
        writeFileSync(file, formatMatrixMarket(M.pattern, M.Ax, M.Az));
        // Ours and KLU alternate, `rounds` times, so that both see the same machine load.
        const oursRuns: LuTiming[] = [];
        const kluRuns: LuTiming[] = [];
        for (let r = 0; r < rounds; r++) {
          oursRuns.push(timeSparseLu(M, repeat));
          const k = useKlu ? runKlu(file, repeat) : null;
          if (k !== null) kluRuns.push(k);
        }
        const ours = medianTiming(oursRuns);
        const klu = kluRuns.length === 0 ? null : medianTiming(kluRuns);
        rows.push({ name: M.name, family, complex, ours, klu, denseMs: null });
        points.push({ n, ms: ours.factorMs });
        if (klu !== null) kluPoints.push({ n, ms: klu.factorMs });
        process.stderr.write(
          `${M.name}: ${JSON.stringify(ours)}${klu === null ? '' : ` klu ${JSON.stringify(klu)}`}\n`,
        );
      }
      if (points.length >= 2) {
        const label = `${family} ${complex ? 'complex' : 'real'}`;
        const kluText = kluPoints.length >= 2 ? `, KLU n^${growthExponent(kluPoints).toFixed(2)}` : '';
        exponents.push(`| ${label} | n^${growthExponent(points).toFixed(2)}${kluText} |`);
      }
    }
  }
  // Dense factorizations last, so that the garbage of a dense LU of order 1,000 (and V8's work
  // on it) cannot weigh on the sparse timings.
  for (const family of FAMILIES) {
    for (const complex of [false, true]) {
      let lastDense: { n: number; ms: number } | null = null;
      for (const size of sizes) {
        const M = familyMatrix(family, size, complex);
        const n = M.pattern.n;
        const predicted = lastDense === null ? 0 : lastDense.ms * (n / lastDense.n) ** 3;
        if (!(predicted < DENSE_BUDGET_MS && (complex ? 2 * n : n) <= DENSE_MAX_ORDER)) continue;
        const denseMs = timeDense(M);
        lastDense = { n, ms: denseMs };
        const index = rows.findIndex((r) => r.name === M.name);
        if (index >= 0) rows[index] = { ...rows[index]!, denseMs };
      }
    }
  }
  for (const { name, ours, klu, denseMs } of rows) {
    lines.push(
      `| ${name} | ${ours.n} | ${ours.nnz} | ${ours.nnzLU} | ${fmt(ours.factorMs)} | ${fmt(ours.refactorMs)} | ${fmt(ours.solveMs)} | ${fmt(ours.residual, 2)} | ${klu?.nnzLU ?? '—'} | ${fmt(klu?.factorMs)} | ${fmt(klu?.refactorMs)} | ${fmt(klu?.solveMs)} | ${klu === null ? '—' : fmt(ours.factorMs / klu.factorMs, 2)} | ${klu === null ? '—' : fmt(ours.refactorMs / klu.refactorMs, 2)} | ${fmt(denseMs)} |`,
    );
  }
  process.stdout.write(
    `${lines.join('\n')}\n\n| family | factor time growth |\n|---|---|\n${exponents.join('\n')}\n`,
  );
  writeFileSync(join(outDir, 'lu-families.json'), `${JSON.stringify(rows, null, 1)}\n`);
  return rows;
}

if (process.argv[1] !== undefined && fileURLToPath(import.meta.url) === process.argv[1]) {
  runLuFamilies(process.argv.slice(2));
}
