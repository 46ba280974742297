/**
 * Plain-data forms of the sweep, AC and linearity results, for storage, other languages and snapshot
 * tests. Typed arrays become arrays; JSON has no Infinity, so infinite values become `null` (as
 * `JSON.stringify` writes them).
 */

import { GROUND } from '../circuit/elements.js';
import type { JunctionProbe } from '../devices/device.js';
import { requireShape } from '../errors/arguments.js';
import type { AcAnalysis } from './ac-analysis.js';
import type { DcSweep, SweptQuantity } from './dc-sweep.js';
import { currentDirection } from './element-currents.js';
import type { LinearityReport } from './linearity.js';

/** A number as JSON: itself when finite, otherwise `null`. */
function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** A DC sweep as plain JSON: the swept values and, per node and element, one value per point. */
export interface DcSweepJson {
  /** What was swept. */
  readonly swept: SweptQuantity;
  /** The swept values, in the order of the sweep. */
  readonly values: readonly number[];
  /** Every node's voltage to ground at every point, in V. */
  readonly nodes: Readonly<Record<string, readonly number[]>>;
  /** Every element current at every point, in A, by the sign conventions of docs/building-circuits.md. */
  readonly currents: Readonly<Record<string, readonly number[]>>;
}

/** The plain-data form of a DC sweep; `JSON.stringify(sweep)` writes it through `DcSweep.toJSON`. */
export function dcSweepToJson(sweep: DcSweep): DcSweepJson {
  requireShape(sweep, 'sweep', 'a DcSweep (the result of dcSweep(circuit, options))', [
    'points',
    'swept',
    'values',
  ]);
  const first = sweep.points[0]!;
  const nodes: Record<string, number[]> = {};
  for (const node of first.nodes) if (node !== GROUND) nodes[node] = Array.from(sweep.voltage(node));
  const currents: Record<string, number[]> = {};
  for (const record of first.system.records) {
    if (currentDirection(record) !== undefined)
      currents[record.name] = Array.from(sweep.current(record.name));
  }
  return { swept: sweep.swept, values: Array.from(sweep.values), nodes, currents };
}

/** Real and imaginary parts of a phasor at every frequency. */
export interface PhasorsJson {
  /** Real parts, one per frequency. */
  readonly re: readonly number[];
  /** Imaginary parts, one per frequency. */
  readonly im: readonly number[];
}

/** An AC analysis as plain JSON: peak phasors of every node voltage and element current. */
export interface AcAnalysisJson {
  /** In Hz, in the order of the analysis. */
  readonly frequencies: readonly number[];
  /** Every node's voltage phasor to ground, in V. */
  readonly nodes: Readonly<Record<string, PhasorsJson>>;
  /** The current phasor of every element that has one, in A. */
  readonly currents: Readonly<Record<string, PhasorsJson>>;
}

/** The plain-data form of an AC analysis; `JSON.stringify(ac)` writes it through `AcAnalysis.toJSON`. */
export function acAnalysisToJson(ac: AcAnalysis): AcAnalysisJson {
  requireShape(ac, 'ac', 'an AcAnalysis (the result of acAnalysis(op, options))', [
    'operatingPoint',
    'frequencies',
    're',
  ]);
  const split = (values: readonly { re: number; im: number }[]): PhasorsJson => ({
    re: values.map((v) => v.re),
    im: values.map((v) => v.im),
  });
  const op = ac.operatingPoint;
  const nodes: Record<string, PhasorsJson> = {};
  for (const node of op.nodes) if (node !== GROUND) nodes[node] = split(ac.voltage(node));
  const currents: Record<string, PhasorsJson> = {};
  for (const device of op.system.devices) {
    if (device.acCurrent !== undefined) currents[device.name] = split(ac.current(device.name));
  }
  return { frequencies: Array.from(ac.frequencies), nodes, currents };
}

/** One junction of a linearity report as JSON. */
export interface JunctionLinearityJson {
  /** The device's element name. */
  readonly device: string;
  /** The device's kind. */
  readonly kind: string;
  /** Which junction (or channel). */
  readonly junction: JunctionProbe['junction'];
  /** The worst frequency, in Hz. */
  readonly frequency: number;
  /** The peak junction voltage there, in V. */
  readonly amplitude: number;
  /** The junction's DC voltage in its forward sense, in V. */
  readonly bias: number;
  /** Whether the junction is forward-biased. */
  readonly forwardBiased: boolean;
  /** n·Vt or the channel overdrive, in V. */
  readonly scale: number;
  /** x = amplitude/scale. */
  readonly normalized: number;
  /** The Lagrange bound of the Taylor remainder relative to the linear term. */
  readonly errorBound: number | null;
  /** 2nd-harmonic over fundamental of the junction current. */
  readonly secondHarmonic: number;
  /** 3rd-harmonic over fundamental of the junction current. */
  readonly thirdHarmonic: number;
  /** Relative rise of the mean junction current. */
  readonly meanShift: number | null;
  /** Whether the error bound is within the budget. */
  readonly withinBudget: boolean;
  /** `null` where no signal reaches the junction (an unlimited scale). */
  readonly maxInputScale: number | null;
  /** The amplitude at every analysed frequency, in V. */
  readonly amplitudes: readonly number[];
  /** The device's share of the output's harmonics, when the report was taken at an output. */
  readonly share?: {
    /** The device's part of the output's 2nd harmonic over the fundamental. */
    readonly second: number | null;
    /** The device's part of the output's 3rd harmonic over the fundamental. */
    readonly third: number | null;
  };
}

/** The verdict at an output as JSON (see `OutputLinearity`); `null` for infinite or missing values. */
export interface OutputLinearityJson {
  /** The output's description, such as `out`, `out − ref` or `current in Rload`. */
  readonly output: string;
  /** The worst analysed frequency, in Hz. */
  readonly frequency: number;
  /** |H1| there (V or A). */
  readonly fundamental: number;
  /** |H2|/|H1|. */
  readonly secondHarmonic: number | null;
  /** |H3|/|H1|. */
  readonly thirdHarmonic: number | null;
  /** Re(C1/H1). */
  readonly compression: number | null;
  /** |M|/|H1|. */
  readonly meanShift: number | null;
  /** The sum of the four. */
  readonly errorBound: number | null;
  /** Whether the error bound is within the budget. */
  readonly withinBudget: boolean;
}

/** A linearity report as plain JSON (see `LinearityReport` for each field). */
export interface LinearityReportJson {
  /** The budget the junctions were judged against. */
  readonly budget: number;
  /** The analysed frequencies, in Hz. */
  readonly frequencies: readonly number[];
  /** One entry per junction, in circuit order. */
  readonly junctions: readonly JunctionLinearityJson[];
  /** `null` where no junction carries signal. */
  readonly maxInputScale: number | null;
  /** The same over forward-biased junctions only; `null` when unlimited. */
  readonly maxInputScaleForwardBiased: number | null;
  /** The worst junction's device and junction, or null. */
  readonly worst: {
    /** The device's element name. */
    readonly device: string;
    /** Which junction. */
    readonly junction: JunctionProbe['junction'];
  } | null;
  /** The verdict: the output's, or the forward-biased junctions' screen without an output. */
  readonly withinBudget: boolean;
  /** The verdict at the output, when one was named. */
  readonly output?: OutputLinearityJson;
}

/** The plain-data form of a linearity report; `JSON.stringify(report)` writes it. */
export function linearityToJson(report: LinearityReport): LinearityReportJson {
  requireShape(report, 'report', 'a LinearityReport (the result of linearity(ac))', [
    'junctions',
    'worst',
    'budget',
  ]);
  return {
    budget: report.budget,
    frequencies: Array.from(report.frequencies),
    junctions: report.junctions.map((j) => ({
      device: j.device,
      kind: j.kind,
      junction: j.junction,
      frequency: j.frequency,
      amplitude: j.amplitude,
      bias: j.bias,
      forwardBiased: j.forwardBiased,
      scale: j.scale,
      normalized: j.normalized,
      errorBound: finiteOrNull(j.errorBound),
      secondHarmonic: j.secondHarmonic,
      thirdHarmonic: j.thirdHarmonic,
      meanShift: finiteOrNull(j.meanShift),
      withinBudget: j.withinBudget,
      maxInputScale: finiteOrNull(j.maxInputScale),
      amplitudes: Array.from(j.amplitudes),
      ...(j.share === undefined
        ? {}
        : { share: { second: finiteOrNull(j.share.second), third: finiteOrNull(j.share.third) } }),
    })),
    maxInputScale: finiteOrNull(report.maxInputScale),
    maxInputScaleForwardBiased: finiteOrNull(report.maxInputScaleForwardBiased),
    worst: report.worst === null ? null : { device: report.worst.device, junction: report.worst.junction },
    withinBudget: report.withinBudget,
    ...(report.output === undefined
      ? {}
      : {
          output: {
            output: report.output.outputName,
            frequency: report.output.frequency,
            fundamental: report.output.fundamental,
            secondHarmonic: finiteOrNull(report.output.secondHarmonic),
            thirdHarmonic: finiteOrNull(report.output.thirdHarmonic),
            compression: finiteOrNull(report.output.compression),
            meanShift: finiteOrNull(report.output.meanShift),
            errorBound: finiteOrNull(report.output.errorBound),
            withinBudget: report.output.withinBudget,
          },
        }),
  };
}
