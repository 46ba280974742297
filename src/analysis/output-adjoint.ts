/**
 * The output's response to a current injected anywhere, at one frequency, from one transposed solve:
 * the output is a linear functional cᵀx of the solution x = A⁻¹b, so cᵀA⁻¹b = yᵀb with Aᵀy = c.
 * A current I injected from unknown `from` to unknown `to` (b[from] −= I, b[to] += I) then reaches the
 * output as I·(y[to] − y[from]). Each device's share of a harmonic costs a few multiplications instead
 * of a solve, which keeps the shares linear in the circuit's size.
 *
 * The matrix is assembled by the analysis's workspace and copied; the workspace's own assembly is put
 * back, so its factorization and residual check stay consistent. The transposed solve's residual
 * r = c − Aᵀy is checked as the forward solves' are.
 */
import { createComplexSolver, type SparseComplexSolver } from '../linalg/index.js';
import type { AcWorkspace } from './ac-workspace.js';
import type { ProbeReader } from './distortion-probe.js';
import { singularAt } from './newton.js';

/** Relative residual above which the transposed solve is refused, as the forward solves'. */
const RESIDUAL_LIMIT = 1e-9;

/** The adjoint of an output: y with Aᵀy = c at the last frequency solved. */
export class OutputAdjoint {
  /** y, real and imaginary parts, length n+1 (y[n] = 0, ground). */
  readonly re: Float64Array;
  readonly im: Float64Array;
  readonly #workspace: AcWorkspace;
  readonly #read: ProbeReader;
  readonly #solver: SparseComplexSolver;
  readonly #Ar: Float64Array;
  readonly #Ai: Float64Array;
  readonly #cRe: Float64Array;
  readonly #cIm: Float64Array;
  readonly #unitRe: Float64Array;
  readonly #unitIm: Float64Array;
  readonly #value = new Float64Array(2);

  /**
   * @param workspace - assembles the small-signal matrix at each frequency
   * @param read - the output's reader for solutions without source excitation
   */
  constructor(workspace: AcWorkspace, read: ProbeReader) {
    this.#workspace = workspace;
    this.#read = read;
    const { n, nnz, pattern } = workspace.system;
    this.#solver = createComplexSolver(pattern);
    this.#Ar = new Float64Array(nnz + 1);
    this.#Ai = new Float64Array(nnz + 1);
    this.re = new Float64Array(n + 1);
    this.im = new Float64Array(n + 1);
    this.#cRe = new Float64Array(n + 1);
    this.#cIm = new Float64Array(n + 1);
    this.#unitRe = new Float64Array(n + 1);
    this.#unitIm = new Float64Array(n + 1);
  }

  /** Factor at `frequency` (Hz) and solve Aᵀy = c for the output's functional c there. */
  solveAt(frequency: number): void {
    const ws = this.#workspace;
    const { n } = ws.system;
    const previous = ws.frequency;
    ws.assembleAt(frequency);
    this.#Ar.set(ws.Ar);
    this.#Ai.set(ws.Ai);
    if (!Number.isNaN(previous)) ws.assembleAt(previous);
    const status = this.#solver.factor(this.#Ar, this.#Ai);
    if (status !== 0)
      throw singularAt(ws.system, status - 1, `in the small-signal circuit at ${frequency} Hz`);
    // The functional's coefficients: the output read from each unit solution.
    const omega = 2 * Math.PI * frequency;
    for (let j = 0; j < n; j++) {
      this.#unitRe[j] = 1;
      this.#read(this.#unitRe, this.#unitIm, omega, this.#value);
      this.#unitRe[j] = 0;
      this.#cRe[j] = this.#value[0]!;
      this.#cIm[j] = this.#value[1]!;
    }
    this.#cRe[n] = 0;
    this.#cIm[n] = 0;
    this.re.set(this.#cRe);
    this.im.set(this.#cIm);
    this.#solver.solveTranspose(this.re, this.im);
    this.re[n] = 0;
    this.im[n] = 0;
    this.#checkResidual(frequency);
  }

  /** out[0], out[1] += the output's response to current (re + j·im) injected from `from` to `to`. */
  addResponse(from: number, to: number, re: number, im: number, out: Float64Array, offset: number): void {
    const dr = this.re[to]! - this.re[from]!;
    const di = this.im[to]! - this.im[from]!;
    out[offset]! += dr * re - di * im;
    out[offset + 1]! += dr * im + di * re;
  }

  /** r = c − Aᵀy against ‖c‖ + ‖A‖·‖y‖ (max norms, |re| + |im| for each modulus). */
  #checkResidual(frequency: number): void {
    const { n, pattern } = this.#workspace.system;
    const { Ap, Ai: rows } = pattern;
    let cNorm = 0;
    let aNorm = 0;
    let yNorm = 0;
    let rNorm = 0;
    let worst = 0;
    for (let j = 0; j < n; j++) {
      cNorm = Math.max(cNorm, Math.abs(this.#cRe[j]!) + Math.abs(this.#cIm[j]!));
      yNorm = Math.max(yNorm, Math.abs(this.re[j]!) + Math.abs(this.im[j]!));
    }
    for (let j = 0; j < n; j++) {
      let rr = this.#cRe[j]!;
      let ri = this.#cIm[j]!;
      for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
        const ar = this.#Ar[p]!;
        const ai = this.#Ai[p]!;
        aNorm = Math.max(aNorm, Math.abs(ar) + Math.abs(ai));
        const yr = this.re[rows[p]!]!;
        const yi = this.im[rows[p]!]!;
        rr -= ar * yr - ai * yi;
        ri -= ar * yi + ai * yr;
      }
      const size = Math.abs(rr) + Math.abs(ri);
      if (size > rNorm) {
        rNorm = size;
        worst = j;
      }
    }
    const scale = cNorm + aNorm * yNorm;
    if (!(rNorm <= RESIDUAL_LIMIT * scale) && !(scale === 0 && rNorm === 0)) {
      throw singularAt(
        this.#workspace.system,
        worst,
        `in the small-signal circuit at ${frequency} Hz (relative residual of the transposed solve ${(rNorm / scale).toExponential(1)})`,
      );
    }
  }
}
