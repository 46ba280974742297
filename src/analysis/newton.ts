/**
 * The damped Newton iteration on a compiled system: load, factor, solve, limit, test. One workspace
 * per compiled system holds every array, so an iteration allocates nothing.
 */
import type { Conditions, DcLoadContext, Device } from '../devices/device.js';
import { singularMatrix } from '../errors/messages.js';
import {
  createRealSolver,
  type RealLinearSolver,
  type SparseRealSolver,
  TypedArena,
} from '../linalg/index.js';
import type { CompiledSystem } from '../mna/system.js';
import type { ResolvedOptions } from './options.js';
import { diagnoseSingular } from './singular-diagnosis.js';

/** Arrays and the solver of one compiled system, reused by every Newton run on it. */
export class NewtonWorkspace {
  readonly x: Float64Array;
  readonly previous: Float64Array;
  /** The iterate a search started from, which every fallback strategy starts from again. */
  readonly start: Float64Array;
  readonly A: Float64Array;
  readonly b: Float64Array;
  readonly residual: Float64Array;
  readonly rowScale: Float64Array;
  /**
   * The node voltages a pseudo-transient step starts from: with `anchored` loads, the conductance
   * added to every node pulls it towards its anchor instead of towards ground.
   */
  readonly anchor: Float64Array;
  /** The residual of a linear solve and then its correction (iterative refinement). */
  readonly correction: Float64Array;
  readonly solver: SparseRealSolver;
  readonly context: DcLoadContext;
  /**
   * The linear devices' share of A and b (b at full source value), loaded once per set of
   * conditions by {@link loadLinearPart}, so that an iteration reloads only the nonlinear devices.
   */
  readonly linearA: Float64Array;
  readonly linearB: Float64Array;
  nonlinearDevices: readonly Device[];
  /** The compiled system the arrays belong to; a value change swaps in a system of the same pattern. */
  system: CompiledSystem;
  readonly #linearContext: DcLoadContext;
  /** The system and conditions linearA and linearB were last loaded for (null: not loaded). */
  linearFor: { readonly system: CompiledSystem; readonly conditions: Conditions } | null = null;
  /** Norms of the last run, for diagnostics. */
  lastUpdateNorm = Number.POSITIVE_INFINITY;
  lastResidualNorm = Number.POSITIVE_INFINITY;
  /** Whether every unknown of x was finite at the last residual pass (checked while reading x). */
  lastIterateFinite = true;
  /** How many rows were within tolerance at the last residual pass (a measure of progress). */
  lastRowsWithin = 0;

  constructor(system: CompiledSystem) {
    this.system = system;
    const { n, nnz } = system;
    // One buffer for every array of the workspace: they live and die together (see TypedArena).
    const arena = new TypedArena(9 * (n + 1) + 2 * (nnz + 1));
    this.x = arena.float64(n + 1);
    this.previous = arena.float64(n + 1);
    this.start = arena.float64(n + 1);
    this.A = arena.float64(nnz + 1);
    this.b = arena.float64(n + 1);
    this.residual = arena.float64(n + 1);
    this.rowScale = arena.float64(n + 1);
    this.anchor = arena.float64(n + 1);
    this.correction = arena.float64(n + 1);
    // One ordering per topology: a later workspace on the same pattern starts from the first's.
    const { symbolic, fill } = system.ordering;
    this.solver = createRealSolver(
      system.pattern,
      symbolic === null ? {} : fill === null ? { symbolic } : { symbolic, capacity: fill },
    );
    this.context = { x: this.x, A: this.A, b: this.b, sourceScale: 1, limited: false, first: true };
    this.linearA = arena.float64(nnz + 1);
    this.linearB = arena.float64(n + 1);
    this.nonlinearDevices = system.devices.filter((d) => d.nonlinear);
    this.#linearContext = {
      x: this.x,
      A: this.linearA,
      b: this.linearB,
      sourceScale: 1,
      limited: false,
      first: true,
    };
  }

  /**
   * Work on `system` from now on: a system of the same unknowns and pattern whose element values
   * changed. The factorization and its pivot order are kept; the next factor refactors.
   */
  useSystem(system: CompiledSystem): void {
    if (system.pattern !== this.system.pattern) throw new Error('a workspace serves one pattern');
    this.system = system;
    this.nonlinearDevices = system.devices.filter((d) => d.nonlinear);
  }

  /** Load the linear devices into linearA and linearB; call after every change of the conditions. */
  loadLinearPart(): void {
    this.linearA.fill(0);
    this.linearB.fill(0);
    for (const d of this.system.devices) if (!d.nonlinear) d.load(this.#linearContext);
  }
}

/** What one Newton run reached. */
export interface NewtonOutcome {
  readonly converged: boolean;
  readonly iterations: number;
  /** The unknown whose column found no pivot, when the run stopped on a singular Jacobian. */
  readonly singularAt?: number;
}

/** Hand the analysis conditions to every device. */
export function prepareDevices(system: CompiledSystem, conditions: Conditions): void {
  for (const d of system.devices) d.prepare?.(conditions);
}

/**
 * Hand the conditions to every device of the workspace's system and reload its linear part, unless
 * the workspace already holds that part for the same system and equal conditions (a repeated solve).
 */
export function prepareWorkspace(ws: NewtonWorkspace, conditions: Conditions): void {
  prepareDevices(ws.system, conditions);
  const last = ws.linearFor;
  if (
    last !== null &&
    last.system === ws.system &&
    last.conditions.temperature === conditions.temperature &&
    last.conditions.thermalVoltage === conditions.thermalVoltage &&
    last.conditions.junctionConductance === conditions.junctionConductance &&
    last.conditions.sourceValues === undefined &&
    conditions.sourceValues === undefined
  ) {
    return;
  }
  ws.loadLinearPart();
  ws.linearFor = { system: ws.system, conditions };
}

/**
 * Load every device at ws.x, plus a conductance `shunt` from every node to ground (to its anchor
 * voltage when `anchored`: the companion of a capacitor after one backward-Euler step): the linear
 * part is copied (its right-hand side scaled by `sourceScale`, which linear devices are proportional
 * to), and only the nonlinear devices are evaluated.
 */
function loadAll(
  ws: NewtonWorkspace,
  sourceScale: number,
  shunt: number,
  first: boolean,
  anchored = false,
): boolean {
  const ctx = ws.context as { -readonly [K in keyof DcLoadContext]: DcLoadContext[K] };
  ws.A.set(ws.linearA);
  const { b, linearB } = ws;
  // 1·v is v exactly, so the full-scale case (every plain Newton iteration) is a copy.
  if (sourceScale === 1) b.set(linearB);
  else for (let i = 0; i < b.length; i++) b[i] = sourceScale * linearB[i]!;
  ctx.sourceScale = sourceScale;
  ctx.first = first;
  ctx.limited = false;
  const devices = ws.nonlinearDevices;
  for (let k = 0; k < devices.length; k++) devices[k]!.load(ctx);
  if (shunt > 0) {
    const diag = ws.system.nodeDiagonal;
    for (let k = 0; k < diag.length; k++) ws.A[diag[k]!]! += shunt;
    if (anchored) {
      const anchor = ws.anchor;
      for (let k = 0; k < diag.length; k++) b[k]! += shunt * anchor[k]!;
    }
  }
  return ctx.limited;
}

/**
 * The residual r = A·x − b of the loaded equations at x and whether every row is within tolerance:
 * |r_i| ≤ rel·(Σ_j |A_ij·x_j| + |b_i|) + abs_i, abs being amperes for node rows, volts for branch rows.
 */
function residualWithin(ws: NewtonWorkspace, o: ResolvedOptions): boolean {
  const { n, nodeCount, pattern } = ws.system;
  const { Ap, Ai } = pattern;
  const { A, b, x, residual: r, rowScale } = ws;
  for (let i = 0; i < n; i++) {
    const bi = b[i]!;
    r[i] = -bi;
    rowScale[i] = Math.abs(bi);
  }
  // The column pass reads every x_j once, so it also tells whether the iterate is finite.
  let finite = true;
  let begin = Ap[0]!;
  for (let j = 0; j < n; j++) {
    const xj = x[j]!;
    if (!Number.isFinite(xj)) finite = false;
    const end = Ap[j + 1]!;
    for (let p = begin; p < end; p++) {
      const term = A[p]! * xj;
      const i = Ai[p]!;
      r[i]! += term;
      rowScale[i]! += Math.abs(term);
    }
    begin = end;
  }
  ws.lastIterateFinite = finite;
  const rel = o.relativeTolerance;
  let outside = 0;
  let norm = 0;
  // Node rows are currents, branch rows voltages: two loops instead of a test per row.
  const currentTolerance = o.currentTolerance;
  for (let i = 0; i < nodeCount; i++) {
    const ri = Math.abs(r[i]!);
    if (!(ri <= rel * rowScale[i]! + currentTolerance)) outside++;
    if (ri > norm || Number.isNaN(ri)) norm = ri;
  }
  const voltageTolerance = o.voltageTolerance;
  for (let i = nodeCount; i < n; i++) {
    const ri = Math.abs(r[i]!);
    if (!(ri <= rel * rowScale[i]! + voltageTolerance)) outside++;
    if (ri > norm || Number.isNaN(ri)) norm = ri;
  }
  ws.lastResidualNorm = norm;
  ws.lastRowsWithin = n - outside;
  return outside === 0;
}

/** Whether the update from `previous` to `x` is within tolerance in every unknown. */
function updateWithin(ws: NewtonWorkspace, o: ResolvedOptions): boolean {
  const { n, nodeCount } = ws.system;
  const { x, previous } = ws;
  const rel = o.relativeTolerance;
  let ok = true;
  let norm = 0;
  // Node unknowns are voltages, branch unknowns currents: two loops instead of a test per unknown.
  const voltageTolerance = o.voltageTolerance;
  for (let i = 0; i < nodeCount; i++) {
    const xi = x[i]!;
    const pi = previous[i]!;
    const d = Math.abs(xi - pi);
    if (!(d <= rel * Math.max(Math.abs(xi), Math.abs(pi)) + voltageTolerance)) ok = false;
    if (d > norm || Number.isNaN(d)) norm = d;
  }
  const currentTolerance = o.currentTolerance;
  for (let i = nodeCount; i < n; i++) {
    const xi = x[i]!;
    const pi = previous[i]!;
    const d = Math.abs(xi - pi);
    if (!(d <= rel * Math.max(Math.abs(xi), Math.abs(pi)) + currentTolerance)) ok = false;
    if (d > norm || Number.isNaN(d)) norm = d;
  }
  ws.lastUpdateNorm = norm;
  return ok;
}

/** Rounds of iterative refinement allowed to one linear solve. */
const REFINEMENT_ROUNDS = 3;

/**
 * Newton iterations before its linear solves are refined. Newton corrects an inexact linear solve at
 * its next iteration, so refinement (an extra pass over the matrix per iteration) pays only where the
 * iteration lingers: a circuit whose equations lose digits to pivot growth settles only once its
 * solves are refined. A linear circuit, solved once, is always refined.
 */
const REFINE_AFTER = 8;

/**
 * Factor and solve in place: previous ← x, x ← A⁻¹b, then refine: while the residual b − A·x of the
 * linear solve is above what rounding allows, solve for a correction with the same factors and add
 * it (iterative refinement; Higham, "Accuracy and Stability of Numerical Algorithms", 2nd ed. 2002,
 * ch. 12): it recovers digits lost to pivot growth, which Newton would otherwise read as an update
 * that never settles (it cannot recover digits the stored equations already lost).
 * Returns 0, or k+1 when column k found no pivot.
 */
function trySolve(ws: NewtonWorkspace, solver: RealLinearSolver = ws.solver, refine = true): number {
  const status = solver.factor(ws.A);
  if (status !== 0) return status;
  const ordering = ws.system.ordering;
  if (ordering.symbolic === null) {
    ordering.symbolic = ws.solver.symbolic;
    ordering.fill = ws.solver.factorSizes();
  }
  ws.previous.set(ws.x);
  ws.x.set(ws.b);
  solver.solve(ws.x);
  ws.x[ws.system.n] = 0;
  for (let round = 0; refine && round < REFINEMENT_ROUNDS; round++) {
    if (!linearResidualLarge(ws)) break;
    solver.solve(ws.correction);
    const x = ws.x;
    const c = ws.correction;
    for (let i = 0; i < ws.system.n; i++) x[i]! += c[i]!;
  }
  return 0;
}

/**
 * Put b − A·x in ws.correction and tell whether any row of it exceeds 64 ulps of that row's
 * Σ|A_ij·x_j| + |b_i| (the size of rounding in an accurate solve, with a margin).
 */
function linearResidualLarge(ws: NewtonWorkspace): boolean {
  const { n, pattern } = ws.system;
  const { Ap, Ai } = pattern;
  const { A, b, x, correction: r, rowScale } = ws;
  for (let i = 0; i < n; i++) {
    r[i] = b[i]!;
    rowScale[i] = Math.abs(b[i]!);
  }
  let begin = Ap[0]!;
  for (let j = 0; j < n; j++) {
    const xj = x[j]!;
    const end = Ap[j + 1]!;
    for (let p = begin; p < end; p++) {
      const term = A[p]! * xj;
      const i = Ai[p]!;
      r[i]! -= term;
      rowScale[i]! += Math.abs(term);
    }
    begin = end;
  }
  let large = false;
  for (let i = 0; i < n; i++) {
    // A non-finite residual is left to the caller's finiteness test: refinement cannot repair it.
    if (Math.abs(r[i]!) > 64 * Number.EPSILON * rowScale[i]!) large = true;
  }
  r[n] = 0;
  return large && allFiniteIn(r, n);
}

function allFiniteIn(v: Float64Array, n: number): boolean {
  for (let i = 0; i < n; i++) if (!Number.isFinite(v[i]!)) return false;
  return true;
}

/**
 * Load the full circuit's Jacobian at `x` (after {@link prepareWorkspace}) and factor it; returns
 * whether it factored. For analyses of a solved point (the cautions' feedback test).
 */
export function loadJacobianAt(ws: NewtonWorkspace, x: Float64Array): boolean {
  ws.x.set(x);
  loadAll(ws, 1, 0, true);
  return ws.solver.factor(ws.A) === 0;
}

/**
 * The diagnosed `singular` error for the circuit as given (full sources, no added conductance),
 * loaded at ws.x, where a factorization found no pivot for unknown k.
 */
export function singularCircuit(ws: NewtonWorkspace, k: number, context: string) {
  loadAll(ws, 1, 0, true);
  return diagnoseSingular(ws.system, ws.A, k, context);
}

/** The `singular` error for unknown k: its node or branch, and the elements that touch it. */
export function singularAt(system: CompiledSystem, k: number, context: string) {
  const label = system.labels[k];
  const nodes = label?.kind === 'node' ? [label.name] : [];
  const elements = [...(system.elementsAt[k] ?? [])];
  return singularMatrix(elements, nodes, context);
}

/**
 * How far a Newton run may go past its budget while it is making progress: up to this many budgets
 * per hundred unknowns (at least one more), so that a long chain whose stages settle one after
 * another is not cut short, while a run that is going nowhere still stops at its budget.
 */
const EXTENSIONS_PER_HUNDRED_UNKNOWNS = 1;

/**
 * Run Newton from ws.x with sources scaled by `sourceScale` and `shunt` siemens from every node to
 * ground (to ws.anchor when `anchored`). Converged means: the last load was taken at x itself (no
 * junction step limited), every KCL and branch residual there is within tolerance, and the update
 * that led to x was too. A step that makes the residual grow is halved (up to four times) before it
 * is accepted. Unless the user fixed the budget, `maxIterations` is extended, one budget at a time,
 * while the last budget brought more rows within tolerance or halved the best residual.
 */
export function runNewton(
  ws: NewtonWorkspace,
  o: ResolvedOptions,
  sourceScale: number,
  shunt: number,
  maxIterations: number,
  anchored = false,
): NewtonOutcome {
  const n = ws.system.n;
  let updateOk = false;
  let bestResidual = Number.POSITIVE_INFINITY;
  let halvings = 0;
  let limit = maxIterations;
  const extensions = Math.max(1, Math.ceil((EXTENSIONS_PER_HUNDRED_UNKNOWNS * n) / 100));
  const cap = o.growIterations ? maxIterations * (1 + extensions) : maxIterations;
  let checkpointResidual = Number.POSITIVE_INFINITY;
  let checkpointRows = 0;
  let mostRows = 0;
  for (let iteration = 0; ; iteration++) {
    const limited = loadAll(ws, sourceScale, shunt, iteration === 0, anchored);
    const residualOk = residualWithin(ws, o);
    if (!ws.lastIterateFinite) return { converged: false, iterations: iteration };
    if (iteration > 0 && !limited && updateOk && residualOk)
      return { converged: true, iterations: iteration };
    if (ws.lastRowsWithin > mostRows) mostRows = ws.lastRowsWithin;
    // Global damping: go halfway back along a step that made an unlimited residual grow (a
    // residual already within tolerance is left alone: only the update test is pending there).
    const grew = !limited && !residualOk && ws.lastResidualNorm > bestResidual;
    if (iteration > 1 && grew && halvings < 4 && iteration < limit) {
      halvings++;
      for (let i = 0; i < n; i++) ws.x[i] = 0.5 * (ws.x[i]! + ws.previous[i]!);
      continue;
    }
    // A step kept after four halvings becomes the new reference, or the next step would be halved
    // back towards it again and the run would cycle.
    if (halvings === 4) bestResidual = ws.lastResidualNorm;
    halvings = 0;
    if (!limited) bestResidual = Math.min(bestResidual, ws.lastResidualNorm);
    if (iteration >= limit) {
      const progress = mostRows > checkpointRows || bestResidual < 0.5 * checkpointResidual;
      if (!progress || limit >= cap) return { converged: false, iterations: iteration };
      checkpointRows = mostRows;
      checkpointResidual = bestResidual;
      limit += maxIterations;
    }
    // A Jacobian that is singular at some iterate (two series junctions both far into conduction,
    // say) ends this run, not the search: the caller's next strategy may avoid that iterate.
    const status = trySolve(ws, ws.solver, iteration >= REFINE_AFTER);
    if (status !== 0) return { converged: false, iterations: iteration, singularAt: status - 1 };
    updateOk = updateWithin(ws, o);
  }
}

/**
 * Load the full circuit (every source at its value, no conductance to ground, no step limiting) at
 * ws.x and leave its residual in ws.residual; returns whether every row is within tolerance. Used to
 * describe a failure by the equations the user wrote, whatever homotopy the last attempt was on.
 */
export function measureResidual(ws: NewtonWorkspace, o: ResolvedOptions): boolean {
  loadAll(ws, 1, 0, true);
  return residualWithin(ws, o);
}

/**
 * How many times row i of the last measured residual exceeds its tolerance (amperes for node rows,
 * volts for branch rows), so that rows of either kind can be ranked together.
 */
export function residualExcess(ws: NewtonWorkspace, o: ResolvedOptions, i: number): number {
  const abs = i < ws.system.nodeCount ? o.currentTolerance : o.voltageTolerance;
  const excess = Math.abs(ws.residual[i]!) / (o.relativeTolerance * ws.rowScale[i]! + abs);
  return Number.isNaN(excess) ? Number.POSITIVE_INFINITY : excess;
}

/** The largest {@link residualExcess} over all rows. */
export function worstResidualExcess(ws: NewtonWorkspace, o: ResolvedOptions): number {
  let worst = 0;
  for (let i = 0; i < ws.system.n; i++) worst = Math.max(worst, residualExcess(ws, o, i));
  return worst;
}

/** Solve a linear system once (no Newton needed) and check its residual. */
export function solveLinear(ws: NewtonWorkspace, o: ResolvedOptions): NewtonOutcome {
  loadAll(ws, 1, 0, true);
  const status = trySolve(ws);
  if (status !== 0) throw diagnoseSingular(ws.system, ws.A, status - 1, 'at the operating point');
  loadAll(ws, 1, 0, false);
  return { converged: residualWithin(ws, o) && ws.lastIterateFinite, iterations: 1 };
}
