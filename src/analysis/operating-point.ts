/**
 * The DC operating point: plain Newton first, then conductance stepping, then source ramping, each
 * tried only when the one before failed. The result is immutable and answers by node and element name.
 */
import { GROUND } from '../circuit/elements.js';
import type { Conditions } from '../devices/device.js';
import { thermalVoltage } from '../devices/junction.js';
import { noConvergence, unknownElement, unknownNode } from '../errors/messages.js';
import type { ResidualEntry, StrategyAttempt } from '../errors/quiescent-error.js';
import type { CompiledSystem } from '../mna/system.js';
import { type Caution, cautionsOf } from './cautions.js';
import {
  measureResidual,
  type NewtonOutcome,
  type NewtonWorkspace,
  prepareWorkspace,
  residualExcess,
  runNewton,
  singularCircuit,
  solveLinear,
  worstResidualExcess,
} from './newton.js';
import { type OperatingPointJson, operatingPointToJson } from './operating-point-json.js';
import type { ResolvedOptions } from './options.js';
import type { BjtReport, DeviceReport, DiodeReport, MosfetReport, OpAmpReport } from './reports.js';

/** The DC solution of a circuit: node voltages, element currents and every device's operating values. */
export class OperatingPoint {
  /** @internal */
  readonly system: CompiledSystem;
  /** @internal The solution vector, length n+1 with x[n] = 0 (ground). */
  readonly x: Float64Array;
  /** @internal */
  readonly conditions: Conditions;
  /** Newton iterations taken, over all strategies tried. */
  readonly iterations: number;
  /** The strategy that found the solution: `'linear'`, `'newton'`, `'conductance-stepping'` or `'source-ramping'`. */
  readonly strategy: string;
  /** Every strategy tried, in order, with its iterations. */
  readonly attempts: readonly StrategyAttempt[];
  #cautions: readonly Caution[] | undefined;

  /** @internal Built by {@link operatingPoint} and the sweeps. */
  constructor(
    system: CompiledSystem,
    x: Float64Array,
    conditions: Conditions,
    attempts: readonly StrategyAttempt[],
  ) {
    this.system = system;
    this.x = x;
    this.conditions = conditions;
    this.attempts = attempts;
    this.iterations = attempts.reduce((sum, a) => sum + a.iterations, 0);
    this.strategy = attempts[attempts.length - 1]?.strategy ?? 'linear';
  }

  /** The temperature of the analysis, in K. */
  get temperature(): number {
    return this.conditions.temperature;
  }

  /** k·T/q at the analysis temperature, in V. */
  get thermalVoltage(): number {
    return this.conditions.thermalVoltage;
  }

  /** The names of the circuit's nodes (ground included). */
  get nodes(): readonly string[] {
    return [...this.system.nodeIndex.keys()];
  }

  /** The voltage of `node` with respect to `reference` (ground by default), in V. */
  voltage(node: string, reference: string = GROUND): number {
    return this.x[nodeAt(this.system, node)]! - this.x[nodeAt(this.system, reference)]!;
  }

  /**
   * The current of an element, in A, by the sign conventions of docs/building-circuits.md: for two-terminal
   * elements from the first node named to the second, for controlled sources their output branch,
   * for an op-amp the current out of its output into the circuit. Transistors are read through
   * {@link OperatingPoint.device}.
   */
  current(element: string): number {
    const d = this.system.deviceByName.get(element);
    if (d === undefined) throw unknownElement(element);
    if (d.current === undefined) {
      throw unknownElement(element, 'a transistor has no single current; read it through device()');
    }
    return d.current(this.x, this.conditions);
  }

  /** The operating values and small-signal parameters of a diode, bipolar transistor or MOSFET, or an op-amp's input, output and region. */
  device(name: string): DeviceReport {
    const d = this.system.deviceByName.get(name);
    if (d === undefined) throw unknownElement(name);
    if (d.report === undefined)
      throw unknownElement(name, 'only diodes, transistors and op-amps have a device report');
    return Object.freeze({ kind: d.record.kind, ...d.report(this.x, this.conditions) }) as DeviceReport;
  }

  /** The report of a diode (throws `unknown-element` if `name` is not one). */
  diode(name: string): DiodeReport {
    return this.#typed(name, 'diode') as DiodeReport;
  }
  /** The report of a bipolar transistor (throws `unknown-element` if `name` is not one). */
  bjt(name: string): BjtReport {
    return this.#typed(name, 'bjt') as BjtReport;
  }
  /** The report of a MOSFET (throws `unknown-element` if `name` is not one). */
  mosfet(name: string): MosfetReport {
    return this.#typed(name, 'mosfet') as MosfetReport;
  }
  /** The report of an op-amp (throws `unknown-element` if `name` is not one). */
  opAmp(name: string): OpAmpReport {
    return this.#typed(name, 'op-amp') as OpAmpReport;
  }

  /**
   * Cautions about the solution as data (code, element or node, the figure that triggered it, and a
   * sentence), empty for a circuit solved within its models: a junction beyond the exponential's
   * limit or reverse-biased beyond any physical breakdown, a node with a single connection, an
   * op-amp in positive feedback, with its inputs far apart or held at an output limit (docs/cautions.md).
   */
  get cautions(): readonly Caution[] {
    this.#cautions ??= Object.freeze(
      cautionsOf(this.system, this.x, this.conditions).map((c) => Object.freeze(c)),
    );
    return this.#cautions;
  }

  /** The {@link OperatingPoint.cautions} in words, one sentence each. */
  get warnings(): readonly string[] {
    return this.cautions.map((c) => c.message);
  }

  /**
   * The operating point as plain data (node voltages, element currents, device reports), so that
   * `JSON.stringify(op)` writes it; infinite values become `null`.
   */
  toJSON(): OperatingPointJson {
    return operatingPointToJson(this);
  }

  #typed(name: string, kind: string): DeviceReport {
    const report = this.device(name);
    if (report.kind !== kind) throw unknownElement(name, `it is a ${report.kind}, not a ${kind}`);
    return report;
  }
}

/** The unknown index of a node, or `unknown-node`. */
export function nodeAt(system: CompiledSystem, node: string): number {
  const k = typeof node === 'string' ? system.nodeIndex.get(node) : undefined;
  if (k === undefined) throw unknownNode(String(node));
  return k;
}

/** The compiled system and its Newton workspace, for analyses that solve many points. */
export interface Solver {
  readonly system: CompiledSystem;
  readonly workspace: NewtonWorkspace;
  readonly options: ResolvedOptions;
}

/** Set the workspace's x to the options' initial guess (0 V wherever none is given). */
export function startFromGuess(solver: Solver): void {
  const { system, workspace, options } = solver;
  workspace.x.fill(0);
  for (const [node, v] of Object.entries(options.initialGuess)) workspace.x[nodeAt(system, node)] = v;
  workspace.x[system.n] = 0;
}

/** The conditions of an analysis at temperature T. */
export function conditionsAt(temperature: number, options: ResolvedOptions): Conditions {
  return {
    temperature,
    thermalVoltage: thermalVoltage(temperature),
    junctionConductance: options.junctionConductance,
  };
}

/**
 * Solve from the workspace's present x (a warm start) at the given conditions, walking the
 * strategies in order. Returns the attempts; throws `no-convergence` when all fail.
 */
export function solveFromCurrent(solver: Solver, conditions: Conditions): OperatingPoint {
  const { system, workspace: ws, options: o } = solver;
  prepareWorkspace(ws, conditions);
  if (!system.nonlinear) {
    const outcome = solveLinear(ws, o);
    const attempts = [{ strategy: 'linear', iterations: outcome.iterations, converged: outcome.converged }];
    if (!outcome.converged) throw failure(solver, attempts);
    return new OperatingPoint(system, ws.x.slice(), conditions, attempts);
  }
  const attempts: StrategyAttempt[] = [];
  // Kept in the workspace: a copy per call would be garbage the size of the circuit every call.
  const start = ws.start;
  start.set(ws.x);
  // On failure, the iterate closest to solving the circuit as given is kept for the diagnosis.
  let closest = start;
  let closestExcess = Number.POSITIVE_INFINITY;
  let firstSingular: number | undefined;
  let singularEverywhere = true;
  for (const strategy of STRATEGIES) {
    ws.x.set(start);
    const outcome = strategy.run(ws, o);
    if (outcome.singularAt === undefined) singularEverywhere = false;
    else firstSingular ??= outcome.singularAt;
    attempts.push({ strategy: strategy.name, iterations: outcome.iterations, converged: outcome.converged });
    if (outcome.converged) return new OperatingPoint(system, ws.x.slice(), conditions, attempts);
    if (!allFinite(ws.x, system.n)) continue;
    measureResidual(ws, o);
    const excess = worstResidualExcess(ws, o);
    if (excess < closestExcess) {
      closestExcess = excess;
      closest = ws.x.slice();
    }
  }
  // A matrix singular in every attempt is a property of the circuit, not of the search.
  if (singularEverywhere && firstSingular !== undefined) {
    ws.x.set(start);
    throw singularCircuit(ws, firstSingular, 'at the operating point');
  }
  ws.x.set(closest);
  throw failure(solver, attempts);
}

function allFinite(x: Float64Array, n: number): boolean {
  for (let i = 0; i < n; i++) if (!Number.isFinite(x[i]!)) return false;
  return true;
}

interface Strategy {
  readonly name: string;
  run(ws: NewtonWorkspace, o: ResolvedOptions): NewtonOutcome;
}

/** The fallback chain, in order of cost. */
const STRATEGIES: readonly Strategy[] = [
  { name: 'newton', run: (ws, o) => runNewton(ws, o, 1, 0, o.maxIterations) },
  {
    // Start with every node tied to ground by 10 mS, and loosen the tie tenfold per solve, then remove it.
    name: 'conductance-stepping',
    run(ws, o) {
      let iterations = 0;
      let shunt = 1e-2;
      let factor = 10;
      let good = ws.x.slice();
      let singular: number | undefined;
      const failed = (): NewtonOutcome =>
        singular === undefined
          ? { converged: false, iterations }
          : { converged: false, iterations, singularAt: singular };
      while (true) {
        const r = runNewton(ws, o, 1, shunt, o.maxIterations);
        iterations += r.iterations;
        singular = r.singularAt ?? singular;
        if (r.converged) {
          if (shunt === 0) return { converged: true, iterations };
          good = ws.x.slice();
          shunt = shunt / factor < 1e-13 ? 0 : shunt / factor;
        } else {
          ws.x.set(good);
          if (shunt === 0) shunt = 1e-13;
          if (factor < 1.01) return failed();
          const back = shunt * factor;
          factor = Math.sqrt(factor);
          shunt = back / factor;
        }
        if (iterations > 20 * o.maxIterations) return failed();
      }
    },
  },
  {
    // Ramp every independent source from zero, shortening the step where Newton struggles.
    name: 'source-ramping',
    run(ws, o) {
      let iterations = 0;
      ws.x.fill(0);
      let scale = 0;
      let stepSize = 0.1;
      let good = ws.x.slice();
      let singular: number | undefined;
      while (scale < 1) {
        const next = Math.min(1, scale + stepSize);
        const r = runNewton(ws, o, next, 0, o.maxIterations);
        iterations += r.iterations;
        singular = r.singularAt ?? singular;
        if (r.converged) {
          scale = next;
          good = ws.x.slice();
          stepSize = Math.min(0.5, stepSize * 2);
        } else {
          ws.x.set(good);
          stepSize /= 4;
          if (stepSize < 1e-7) {
            return singular === undefined
              ? { converged: false, iterations }
              : { converged: false, iterations, singularAt: singular };
          }
        }
      }
      return { converged: true, iterations };
    },
  },
  {
    name: 'pseudo-transient',
    run: pseudoTransient,
  },
];

/** Largest and smallest conductance per node of the pseudo-transient steps, in S. */
const PSEUDO_TRANSIENT_START = 1e-2;
const PSEUDO_TRANSIENT_GIVE_UP = 1e3;
/** Below this conductance per node the steps are long enough to try the circuit as given. */
const PSEUDO_TRANSIENT_FINISH = 1e-12;

/**
 * Pseudo-transient continuation (Kelley & Keyes, "Convergence analysis of pseudo-transient
 * continuation", SIAM J. Numer. Anal. 35, 1998): a capacitor C from every node to ground, and the
 * circuit stepped in time with backward Euler from the start, so that each step solves the circuit
 * plus a conductance g = C/h from every node to its voltage at the last step. Unlike conductance
 * stepping, whose conductances pull every node to 0 V and whose path can fold back on a high-gain
 * stage, the path here follows the circuit's own relaxation, which reaches a stable solution of the
 * DC equations for any circuit whose nodes all have a capacitance to ground. The step h (that is,
 * 1/g) grows fourfold after a step that converged in few iterations and shrinks fourfold after one
 * that did not (iteration-count step control, common practice); once g is below
 * {@link PSEUDO_TRANSIENT_FINISH}, or the state stops moving, plain Newton finishes from there.
 */
function pseudoTransient(ws: NewtonWorkspace, o: ResolvedOptions): NewtonOutcome {
  const n = ws.system.n;
  let iterations = 0;
  let g = PSEUDO_TRANSIENT_START;
  // Each step is allowed a short run: a step that needs more is too long and is shortened.
  const perStep = Math.min(o.maxIterations, 25);
  const budget = o.maxIterations * (20 + Math.ceil(n / 10));
  ws.anchor.set(ws.x);
  while (iterations <= budget) {
    const r = runNewton(ws, o, 1, g, perStep, true);
    iterations += r.iterations;
    if (!r.converged) {
      ws.x.set(ws.anchor);
      g *= 4;
      if (g > PSEUDO_TRANSIENT_GIVE_UP) return { converged: false, iterations };
      continue;
    }
    // A step that left every node where it started has reached a steady state: the capacitors
    // carry no current, so x solves the circuit as given, which the residual confirms (the
    // Jacobian there may be too ill-conditioned for plain Newton to accept an update).
    if (stateSettled(ws, o) && measureResidual(ws, o)) return { converged: true, iterations };
    if (g < PSEUDO_TRANSIENT_FINISH) {
      const finish = runNewton(ws, o, 1, 0, o.maxIterations);
      iterations += finish.iterations;
      if (finish.converged) return { converged: true, iterations };
      ws.x.set(ws.anchor);
      g = PSEUDO_TRANSIENT_FINISH * 4;
      continue;
    }
    ws.anchor.set(ws.x);
    if (r.iterations <= 4) g /= 4;
    else if (r.iterations > perStep / 2) g *= 2;
  }
  return { converged: false, iterations };
}

/** Whether the last pseudo-transient step left every node where it started (within tolerance). */
function stateSettled(ws: NewtonWorkspace, o: ResolvedOptions): boolean {
  const { x, anchor } = ws;
  for (let i = 0; i < ws.system.nodeCount; i++) {
    const d = Math.abs(x[i]! - anchor[i]!);
    if (!(d <= o.relativeTolerance * Math.abs(x[i]!) + o.voltageTolerance)) return false;
  }
  return true;
}

/** The `no-convergence` error with the worst residuals and the nonlinear devices touching them. */
function failure(solver: Solver, attempts: readonly StrategyAttempt[]) {
  const { system, workspace: ws, options } = solver;
  // The last attempt may have stopped on a homotopy (scaled sources, a conductance to ground); the
  // residuals reported are those of the circuit as given, at the point reached.
  const updateNorm = ws.lastUpdateNorm;
  measureResidual(ws, options);
  const excess = Array.from({ length: system.n }, (_, i) => residualExcess(ws, options, i));
  // The five rows furthest outside their tolerance, largest first. When every row is within its
  // tolerance (the updates, not the residuals, never settled), the five closest to their limit: a
  // failure always names where it is held back.
  const ranked = Array.from({ length: system.n }, (_, i) => i).sort((a, b) => excess[b]! - excess[a]!);
  const outside = ranked.filter((i) => excess[i]! > 1);
  const order = (outside.length > 0 ? outside : ranked).slice(0, 5);
  const worstResiduals: ResidualEntry[] = order.map((i) => ({
    name: system.labels[i]!.name,
    kind: system.labels[i]!.kind,
    residual: ws.residual[i]!,
  }));
  const devices = new Set<string>();
  for (const i of order) {
    for (const name of system.elementsAt[i] ?? []) {
      if (system.deviceByName.get(name)?.nonlinear) devices.add(name);
    }
  }
  // Rows touched only by linear elements still name something: the elements at those rows.
  if (devices.size === 0)
    for (const i of order) for (const name of system.elementsAt[i] ?? []) devices.add(name);
  return noConvergence({
    residualsWithinTolerance: outside.length === 0,
    strategies: attempts,
    worstResiduals,
    devices: [...devices],
    lastUpdateNorm: Number.isNaN(updateNorm) ? Number.POSITIVE_INFINITY : updateNorm,
    lastResidualNorm: Number.isNaN(ws.lastResidualNorm) ? Number.POSITIVE_INFINITY : ws.lastResidualNorm,
  });
}
