/**
 * The complex linear system of the small-signal circuit at one frequency: every device's admittances at
 * the operating point, stamped through the slots of the DC pattern, factored by one complex sparse
 * solver whose symbolic analysis serves the whole sweep. The AC analysis, the port impedances and the
 * distortion estimate all solve on it.
 */
import type { AcLoadContext } from '../devices/device.js';
import { type ComplexLinearSolver, createComplexSolver } from '../linalg/index.js';
import type { CompiledSystem } from '../mna/system.js';
import { prepareDevices, singularAt } from './newton.js';
import type { OperatingPoint } from './operating-point.js';

/** Relative residual above which a complex solve is refused as numerically singular. */
export const AC_RESIDUAL_LIMIT = 1e-9;

/** The small-signal system of one operating point, reused across frequencies. */
export class AcWorkspace {
  readonly system: CompiledSystem;
  readonly op: OperatingPoint;
  /** Matrix values (real, imaginary), length nnz+1 (the last is the ground trash slot). */
  readonly Ar: Float64Array;
  readonly Ai: Float64Array;
  /** The excitation the sources wrote at the last assembly, length n+1. */
  readonly sourceRe: Float64Array;
  readonly sourceIm: Float64Array;
  readonly #solver: ComplexLinearSolver;
  readonly #context: AcLoadContext & { omega: number };
  readonly #residualRe: Float64Array;
  readonly #residualIm: Float64Array;
  #frequency = Number.NaN;

  constructor(op: OperatingPoint) {
    this.op = op;
    this.system = op.system;
    const { n, nnz } = this.system;
    this.Ar = new Float64Array(nnz + 1);
    this.Ai = new Float64Array(nnz + 1);
    this.sourceRe = new Float64Array(n + 1);
    this.sourceIm = new Float64Array(n + 1);
    this.#residualRe = new Float64Array(n + 1);
    this.#residualIm = new Float64Array(n + 1);
    this.#solver = createComplexSolver(this.system.pattern);
    this.#context = { x: op.x, omega: 0, Ar: this.Ar, Ai: this.Ai, br: this.sourceRe, bi: this.sourceIm };
  }

  /** The frequency of the last successful factorization, in Hz (NaN before the first). */
  get frequency(): number {
    return this.#frequency;
  }

  /**
   * Stamp every device at `frequency` (Hz) and factor. Throws `singular` naming the unknown that found
   * no pivot.
   */
  factorAt(frequency: number): void {
    const ctx = this.#context;
    ctx.omega = 2 * Math.PI * frequency;
    this.Ar.fill(0);
    this.Ai.fill(0);
    this.sourceRe.fill(0);
    this.sourceIm.fill(0);
    prepareDevices(this.system, this.op.conditions);
    for (const d of this.system.devices) d.loadAc(ctx);
    const status = this.#solver.factor(this.Ar, this.Ai);
    if (status !== 0) {
      this.#frequency = Number.NaN;
      throw singularAt(this.system, status - 1, `in the small-signal circuit at ${frequency} Hz`);
    }
    this.#frequency = frequency;
  }

  /**
   * Overwrite (re, im), an excitation of length n+1, with the solution of the last factored system, and
   * check its residual. re[n] and im[n] are set to 0 (ground).
   */
  solve(re: Float64Array, im: Float64Array): void {
    const n = this.system.n;
    const rr = this.#residualRe;
    const ri = this.#residualIm;
    rr.set(re);
    ri.set(im);
    this.#solver.solve(re, im);
    re[n] = 0;
    im[n] = 0;
    this.#checkResidual(re, im, rr, ri);
  }

  /** r = b − A·x on the pattern, against ‖b‖ + ‖A‖·‖x‖ (max norms); refuse a solve that misses. */
  #checkResidual(xr: Float64Array, xi: Float64Array, rr: Float64Array, ri: Float64Array): void {
    const { n, pattern } = this.system;
    const { Ap, Ai: rows } = pattern;
    const Ar = this.Ar;
    const Az = this.Ai;
    let bNorm = 0;
    let aNorm = 0;
    let xNorm = 0;
    for (let i = 0; i < n; i++) bNorm = Math.max(bNorm, Math.hypot(rr[i]!, ri[i]!));
    for (let j = 0; j < n; j++) {
      const vr = xr[j]!;
      const vi = xi[j]!;
      xNorm = Math.max(xNorm, Math.hypot(vr, vi));
      for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
        const i = rows[p]!;
        const ar = Ar[p]!;
        const ai = Az[p]!;
        aNorm = Math.max(aNorm, Math.hypot(ar, ai));
        rr[i]! -= ar * vr - ai * vi;
        ri[i]! -= ar * vi + ai * vr;
      }
    }
    let rNorm = 0;
    for (let i = 0; i < n; i++) rNorm = Math.max(rNorm, Math.hypot(rr[i]!, ri[i]!));
    const scale = bNorm + aNorm * xNorm;
    if (!(rNorm <= AC_RESIDUAL_LIMIT * scale) && !(scale === 0 && rNorm === 0)) {
      let worst = 0;
      for (let i = 1; i < n; i++) {
        if (Math.hypot(rr[i]!, ri[i]!) > Math.hypot(rr[worst]!, ri[worst]!)) worst = i;
      }
      throw singularAt(
        this.system,
        worst,
        `in the small-signal circuit at ${this.#frequency} Hz (relative residual ${(rNorm / scale).toExponential(1)})`,
      );
    }
  }
}
