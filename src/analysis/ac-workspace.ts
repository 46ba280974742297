/**
 * The complex linear system of the small-signal circuit at one frequency: every device's admittances at
 * the operating point, stamped through the slots of the DC pattern, factored by one complex sparse
 * solver whose symbolic analysis serves the whole sweep. The AC analysis, the port impedances and the
 * distortion estimate all solve on it.
 *
 * Most devices stamp G + jωC with G and C fixed by the operating point, so the workspace stamps them
 * once, at ω = 0 and ω = 1, and each frequency only forms G + jωC and restamps the few devices whose
 * admittance is not of that form (the op-amp's pole). The nonlinear models are evaluated once per sweep.
 */
import type { AcLoadContext, Device } from '../devices/device.js';
import { KINDS } from '../devices/registry.js';
import { createComplexSolver, type SparseComplexSolver } from '../linalg/index.js';
import type { CompiledSystem } from '../mna/system.js';
import { singularAt } from './newton.js';
import type { OperatingPoint } from './operating-point.js';

/** Relative residual above which a complex solve is refused as numerically singular. */
const AC_RESIDUAL_LIMIT = 1e-9;

/** The small-signal system of one operating point, reused across frequencies. */
export class AcWorkspace {
  /** The compiled circuit of {@link AcWorkspace.op}. */
  readonly system: CompiledSystem;
  /** The operating point every device is linearized at. */
  readonly op: OperatingPoint;
  /** Matrix values (real, imaginary) at the last assembly, length nnz+1 (the last is the ground trash slot). */
  readonly Ar: Float64Array;
  readonly Ai: Float64Array;
  /** The excitation the sources wrote at the last assembly, length n+1. */
  readonly sourceRe: Float64Array;
  readonly sourceIm: Float64Array;
  readonly #solver: SparseComplexSolver;
  readonly #context: AcLoadContext & { omega: number };
  /** G and C of the frequency-affine devices (real and imaginary parts of each), and their excitation. */
  readonly #conductanceRe: Float64Array;
  readonly #conductanceIm: Float64Array;
  readonly #capacitanceRe: Float64Array;
  /**
   * Whether G is real and C imaginary (no stamp puts a frequency-independent imaginary part or a
   * real part proportional to ω): then a frequency reads two arrays instead of four.
   */
  readonly #plainAdmittance: boolean;
  readonly #capacitanceIm: Float64Array;
  readonly #baseSourceRe: Float64Array;
  readonly #baseSourceIm: Float64Array;
  /** Devices restamped at every frequency. */
  readonly #perFrequency: readonly Device[];
  readonly #residualRe: Float64Array;
  readonly #residualIm: Float64Array;
  #frequency = Number.NaN;
  /** Largest |Re| + |Im| of each row, and of the whole matrix, at the last assembly. */
  readonly #rowMax: Float64Array;
  #aNorm = 0;

  /** Evaluate every frequency-affine device once at `op` (G and C); nothing is factored yet. */
  constructor(op: OperatingPoint) {
    this.op = op;
    this.system = op.system;
    const { n, nnz, devices } = this.system;
    this.Ar = new Float64Array(nnz + 1);
    this.Ai = new Float64Array(nnz + 1);
    this.sourceRe = new Float64Array(n + 1);
    this.sourceIm = new Float64Array(n + 1);
    this.#residualRe = new Float64Array(n + 1);
    this.#residualIm = new Float64Array(n + 1);
    this.#rowMax = new Float64Array(n);
    // The DC ordering serves the AC matrix: jωC entries sit on the same pattern.
    const { symbolic, fill } = this.system.ordering;
    this.#solver = createComplexSolver(
      this.system.pattern,
      symbolic === null ? {} : fill === null ? { symbolic } : { symbolic, capacity: fill },
    );
    this.#context = {
      x: op.x,
      omega: 0,
      Ar: this.Ar,
      Ai: this.Ai,
      br: this.sourceRe,
      bi: this.sourceIm,
      conditions: op.conditions,
    };

    const affine = devices.filter((d) => KINDS[d.record.kind].frequencyAffine);
    this.#perFrequency = devices.filter((d) => !KINDS[d.record.kind].frequencyAffine);
    // G + jωC is linear in ω: its stamps at ω = 0 and ω = 1 give G and C.
    this.#stampAt(affine, 0);
    this.#conductanceRe = this.Ar.slice();
    this.#conductanceIm = this.Ai.slice();
    this.#baseSourceRe = this.sourceRe.slice();
    this.#baseSourceIm = this.sourceIm.slice();
    this.#stampAt(affine, 1);
    this.#capacitanceRe = this.Ar.slice();
    this.#capacitanceIm = this.Ai.slice();
    let plain = true;
    for (let p = 0; p <= nnz; p++) {
      this.#capacitanceRe[p]! -= this.#conductanceRe[p]!;
      this.#capacitanceIm[p]! -= this.#conductanceIm[p]!;
      if (this.#conductanceIm[p] !== 0 || this.#capacitanceRe[p] !== 0) plain = false;
    }
    this.#plainAdmittance = plain;
  }

  /** The frequency of the last successful factorization, in Hz (NaN before the first). */
  get frequency(): number {
    return this.#frequency;
  }

  /** Fill {@link AcWorkspace.Ar}, {@link AcWorkspace.Ai} and the excitation with the system at `frequency` (Hz). */
  assembleAt(frequency: number): void {
    const omega = 2 * Math.PI * frequency;
    const perFrequency = this.#perFrequency;
    // With G real, C imaginary and nothing stamped per frequency (every kind of the library but a
    // finite-bandwidth op-amp), one pass over two arrays forms the values and the norms.
    const fused = this.#plainAdmittance && perFrequency.length === 0;
    if (fused) {
      this.#formPlainWithNorms(omega);
    } else {
      const { Ar, Ai } = this;
      const gr = this.#conductanceRe;
      const gi = this.#conductanceIm;
      const cr = this.#capacitanceRe;
      const ci = this.#capacitanceIm;
      for (let p = 0; p < Ar.length; p++) {
        Ar[p] = gr[p]! + omega * cr[p]!;
        Ai[p] = gi[p]! + omega * ci[p]!;
      }
    }
    this.sourceRe.set(this.#baseSourceRe);
    this.sourceIm.set(this.#baseSourceIm);
    if (perFrequency.length > 0) {
      const ctx = this.#context;
      ctx.omega = omega;
      // Prepared once, at construction: only the frequency changes here.
      for (const d of perFrequency) d.loadAc(ctx);
    }
    if (!fused) this.#measureNorms();
  }

  /**
   * Ar = G and Ai = ωC where G is real and C imaginary (the values of the general form up to the
   * sign of a zero), with every row's largest |Re| + |Im| and the largest of all, in one pass.
   */
  #formPlainWithNorms(omega: number): void {
    const { Ar, Ai } = this;
    const g = this.#conductanceRe;
    const c = this.#capacitanceIm;
    const rows = this.system.pattern.Ai;
    const rowMax = this.#rowMax;
    rowMax.fill(0);
    let aNorm = 0;
    const nnz = rows.length;
    for (let p = 0; p < nnz; p++) {
      const re = g[p]! + 0;
      const im = 0 + omega * c[p]!;
      Ar[p] = re;
      Ai[p] = im;
      const a = Math.abs(re) + Math.abs(im);
      const i = rows[p]!;
      if (a > rowMax[i]!) rowMax[i] = a;
      if (a > aNorm) aNorm = a;
    }
    Ar[nnz] = g[nnz]! + 0;
    Ai[nnz] = 0 + omega * c[nnz]!;
    this.#aNorm = aNorm;
  }

  /** Every row's largest |Re| + |Im| of the values in Ar, Ai, and the largest of all. */
  #measureNorms(): void {
    const { Ar, Ai } = this;
    const rows = this.system.pattern.Ai;
    const rowMax = this.#rowMax;
    rowMax.fill(0);
    let aNorm = 0;
    for (let p = 0; p < rows.length; p++) {
      const a = Math.abs(Ar[p]!) + Math.abs(Ai[p]!);
      const i = rows[p]!;
      if (a > rowMax[i]!) rowMax[i] = a;
      if (a > aNorm) aNorm = a;
    }
    this.#aNorm = aNorm;
  }

  /**
   * Assemble at `frequency` (Hz) and factor. Throws `singular` naming the unknown that found no pivot.
   */
  factorAt(frequency: number): void {
    this.assembleAt(frequency);
    const status = this.#solver.factor(this.Ar, this.Ai, this.#rowMax);
    if (status !== 0) {
      this.#frequency = Number.NaN;
      throw singularAt(this.system, status - 1, `in the small-signal circuit at ${frequency} Hz`);
    }
    this.#frequency = frequency;
  }

  /** Zero the assembly buffers and stamp `devices` at angular frequency `omega`. */
  #stampAt(devices: readonly Device[], omega: number): void {
    this.Ar.fill(0);
    this.Ai.fill(0);
    this.sourceRe.fill(0);
    this.sourceIm.fill(0);
    this.#context.omega = omega;
    for (const d of devices) d.loadAc(this.#context);
  }

  /**
   * Overwrite (re, im), an excitation of length n+1, with the solution of the last factored system, and
   * check its residual. re[n] and im[n] are set to 0 (ground).
   */
  solve(re: Float64Array, im: Float64Array): void {
    this.#keepRightHandSide(re, im);
    this.#solver.solve(re, im);
    re[this.system.n] = 0;
    im[this.system.n] = 0;
    this.#checkResidual(re, im, this.#residualRe, this.#residualIm);
  }

  /** Keep b = (re, im) in the residual arrays before a solve overwrites it. */
  #keepRightHandSide(re: Float64Array, im: Float64Array): void {
    this.#residualRe.set(re);
    this.#residualIm.set(im);
  }

  /**
   * Overwrite (re, im), a right-hand side of length n+1, with the solution of the transposed system
   * Aᵀ·z = b (plain transpose, no conjugation) of the last factored system, and check its residual.
   * Its solution z gives the output response y = cᵀ·x to every excitation b at once, as y = zᵀ·b,
   * when (re, im) held the output's coefficients c (the adjoint method). re[n] and im[n] are set to 0.
   */
  solveTranspose(re: Float64Array, im: Float64Array): void {
    this.#keepRightHandSide(re, im);
    this.#solver.solveTranspose(re, im);
    re[this.system.n] = 0;
    im[this.system.n] = 0;
    this.#checkResidual(re, im, this.#residualRe, this.#residualIm, true);
  }

  /**
   * r = b − A·x (or b − Aᵀ·x) on the pattern, against ‖b‖ + ‖A‖·‖x‖ (max norms); refuse a solve that misses. Each
   * complex modulus is bounded by |re| + |im| (within √2 of it), which is ample against the limit and
   * far cheaper than Math.hypot on every nonzero.
   */
  #checkResidual(
    xr: Float64Array,
    xi: Float64Array,
    rr: Float64Array,
    ri: Float64Array,
    transposed = false,
  ): void {
    const { n, pattern } = this.system;
    const { Ap, Ai: rows } = pattern;
    const Ar = this.Ar;
    const Az = this.Ai;
    let bNorm = 0;
    let xNorm = 0;
    for (let i = 0; i < n; i++) bNorm = Math.max(bNorm, Math.abs(rr[i]!) + Math.abs(ri[i]!));
    if (transposed) {
      // (Aᵀx)_j = Σ over column j of A(i, j)·x_i.
      for (let j = 0; j < n; j++) {
        xNorm = Math.max(xNorm, Math.abs(xr[j]!) + Math.abs(xi[j]!));
        let sr = 0;
        let si = 0;
        for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
          const i = rows[p]!;
          const ar = Ar[p]!;
          const ai = Az[p]!;
          sr += ar * xr[i]! - ai * xi[i]!;
          si += ar * xi[i]! + ai * xr[i]!;
        }
        rr[j]! -= sr;
        ri[j]! -= si;
      }
    }
    let begin = Ap[0]!;
    for (let j = 0; j < n && !transposed; j++) {
      const vr = xr[j]!;
      const vi = xi[j]!;
      xNorm = Math.max(xNorm, Math.abs(vr) + Math.abs(vi));
      const end = Ap[j + 1]!;
      if (vr === 0 && vi === 0) {
        begin = end;
        continue;
      }
      for (let p = begin; p < end; p++) {
        const i = rows[p]!;
        const ar = Ar[p]!;
        const ai = Az[p]!;
        rr[i]! -= ar * vr - ai * vi;
        ri[i]! -= ar * vi + ai * vr;
      }
      begin = end;
    }
    const aNorm = this.#aNorm;
    let rNorm = 0;
    for (let i = 0; i < n; i++) rNorm = Math.max(rNorm, Math.abs(rr[i]!) + Math.abs(ri[i]!));
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
