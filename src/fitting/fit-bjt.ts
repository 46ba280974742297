/**
 * Fitting a bipolar transistor to curve-tracer measurements: the forward Gummel sweep (I_C and I_B
 * against V_BE with the collector at the base's voltage) gives I_S, n_F, β_F and the knee current;
 * output curves (I_C against V_CE at a stepped base current or base-emitter voltage) give the Early
 * voltage. Each model evaluation is the library's own operating-point solve of one transistor copy
 * per measured point, so the fitted law is exactly the builder's.
 */

import { DEFAULT_TEMPERATURE } from '../analysis/options.js';
import { Circuit } from '../circuit/circuit.js';
import { GROUND } from '../circuit/elements.js';
import type { BjtModel } from '../devices/bjt/bjt-model.js';
import { thermalVoltage } from '../devices/junction.js';
import { invalidValue } from '../errors/messages.js';
import {
  FIT_JUNCTION_CONDUCTANCE,
  type FitResult,
  type FittedParameter,
  fitParameters,
  straightLine,
} from './fit-parameters.js';
import { type Measurements, readMeasurements } from './measurements.js';
import { PartCopies } from './part-copies.js';

/** Options of {@link fitBjtGummel}. */
export interface BjtGummelFitOptions {
  /** `'npn'` (default) or `'pnp'`; a pnp's sweep is given in magnitudes (veb, and currents out of the terminals). */
  readonly polarity?: 'npn' | 'pnp';
  /** The temperature of the measurement, in K (default: the operating point's); the model is referred to it. */
  readonly temperature?: number;
  /**
   * Parameters held rather than fitted, e.g. `{ kneeCurrent: Infinity }` for a sweep that stays
   * below high injection; any other model parameter may be given here too.
   */
  readonly fixed?: Readonly<Partial<Record<Exclude<keyof BjtModel, 'polarity'>, number>>>;
}

/**
 * Fit I_S, n_F, β_F and the knee current to a forward Gummel sweep: columns `baseEmitterVoltage`
 * (V), `collectorCurrent` and `baseCurrent` (A), measured with the base-collector voltage at 0.
 * Residuals are ln(I_model/I_measured) of both currents, so every decade weighs alike. Points with a
 * current of 0 or less, or a value that is not a finite number, are ignored.
 *
 * @param data - the sweep, as arrays or CSV text with those columns
 * @param options - polarity, temperature and held parameters
 * @returns the model for the builder, standard errors, the residual (in ln A) and the ignored points
 * @throws QuiescentError `invalid-value` for missing columns, unequal lengths or too few usable points
 */
export function fitBjtGummel(
  data: Measurements<'baseEmitterVoltage' | 'collectorCurrent' | 'baseCurrent'>,
  options: BjtGummelFitOptions = {},
): FitResult<BjtModel> {
  const { columns, count, unusable } = readMeasurements(data, [
    'baseEmitterVoltage',
    'collectorCurrent',
    'baseCurrent',
  ]);
  const ignored = new Set(unusable);
  for (let i = 0; i < count; i++) {
    if (!(columns.collectorCurrent[i]! > 0 && columns.baseCurrent[i]! > 0)) ignored.add(i);
  }
  const used = [...Array(count).keys()].filter((i) => !ignored.has(i));
  const vbe = used.map((i) => columns.baseEmitterVoltage[i]!);
  const ic = used.map((i) => columns.collectorCurrent[i]!);
  const ib = used.map((i) => columns.baseCurrent[i]!);
  const polarity = options.polarity ?? 'npn';
  const temperature = options.temperature ?? DEFAULT_TEMPERATURE;
  const fixed = options.fixed ?? {};
  const parameters = gummelStart(vbe, ic, ib, thermalVoltage(temperature)).filter(
    (q) => fixed[q.name as keyof typeof fixed] === undefined,
  );
  const sign = polarity === 'npn' ? 1 : -1;
  const copies = new PartCopies<BjtModel>(
    vbe.map((_, k) => `Q${k}`),
    (model) => {
      const circuit = new Circuit();
      vbe.forEach((v, k) => {
        // The collector on the base's node: vbc = 0, the forward Gummel condition.
        circuit
          .voltageSource(`sweep${k}`, `base${k}`, GROUND, { dc: sign * v })
          .bjt(`Q${k}`, { collector: `base${k}`, base: `base${k}`, emitter: GROUND }, model);
      });
      return circuit;
    },
  );
  const fit = fitParameters(
    parameters,
    2 * used.length,
    (values, out) => {
      const model: BjtModel = { ...fixed, ...values, polarity, referenceTemperature: temperature };
      const op = copies.solve(model, { temperature, junctionConductance: FIT_JUNCTION_CONDUCTANCE });
      vbe.forEach((_, k) => {
        const report = op.bjt(`Q${k}`);
        out[2 * k] = Math.log(report.ic / ic[k]!);
        out[2 * k + 1] = Math.log(report.ib / ib[k]!);
      });
      return true;
    },
    ['measurements'],
  );
  return {
    model: { ...fixed, ...fit.values, polarity, referenceTemperature: temperature },
    standardErrors: fit.standardErrors,
    residual: { rms: fit.rms, sumOfSquares: fit.sumOfSquares, measure: 'ln(I_model/I_measured)' },
    ignored: [...ignored].sort((a, b) => a - b),
    iterations: fit.iterations,
  };
}

/**
 * Starting values: the semilog line of I_C through the lower third of the sweep (slope 1/(n_F·Vt),
 * intercept ln I_S), β_F as the median of I_C/I_B there, and the knee current at the largest I_C.
 */
function gummelStart(vbe: number[], ic: number[], ib: number[], vt: number): FittedParameter[] {
  const order = [...vbe.keys()].sort((a, b) => ic[a]! - ic[b]!);
  const low = order.slice(0, Math.max(2, Math.ceil(order.length / 3)));
  const line = straightLine(
    low.map((i) => vbe[i]!),
    low.map((i) => Math.log(ic[i]!)),
  );
  const n = line.slope > 0 ? 1 / (line.slope * vt) : 1;
  const ratios = low.map((i) => ic[i]! / ib[i]!).sort((a, b) => a - b);
  const beta = ratios[Math.floor(ratios.length / 2)]!;
  return [
    { name: 'saturationCurrent', logarithmic: true, start: Math.exp(line.intercept) },
    { name: 'forwardEmissionCoefficient', logarithmic: false, start: n },
    { name: 'forwardBeta', logarithmic: true, start: beta > 0 ? beta : 100 },
    { name: 'kneeCurrent', logarithmic: true, start: ic[order[order.length - 1]!]! },
  ];
}

/** Options of {@link fitBjtEarlyVoltage}. */
export interface BjtEarlyVoltageFitOptions {
  /** The temperature of the measurement, in K (default: the operating point's). */
  readonly temperature?: number;
  /** Points below this collector-emitter voltage (in magnitude) are ignored as saturated, in V (default 0.5). */
  readonly minimumCollectorEmitterVoltage?: number;
}

/**
 * Fit the Early voltage to output curves, every other parameter held at `model` (a Gummel fit's):
 * columns `collectorEmitterVoltage` (V) and `collectorCurrent` (A), and for each point the base drive
 * the curve tracer held, either `baseCurrent` (A) or `baseEmitterVoltage` (V). Residuals are
 * ln(I_C,model/I_C,measured). Points below `minimumCollectorEmitterVoltage` (saturation), with a
 * collector current of 0 or less, or a value that is not a finite number, are ignored.
 *
 * @param data - the output curves, as arrays or CSV text
 * @param model - the transistor's model from the Gummel fit (its `earlyVoltage` is the starting value when finite)
 * @param options - temperature and the saturation limit
 * @returns the model with `earlyVoltage` fitted, its standard error, the residual and the ignored points
 * @throws QuiescentError `invalid-value` for missing columns (neither base drive), unequal lengths or too few usable points
 */
export function fitBjtEarlyVoltage(
  data: Measurements<'collectorEmitterVoltage' | 'collectorCurrent', 'baseCurrent' | 'baseEmitterVoltage'>,
  model: BjtModel,
  options: BjtEarlyVoltageFitOptions = {},
): FitResult<BjtModel> {
  const { columns, count, unusable } = readMeasurements<
    'collectorEmitterVoltage' | 'collectorCurrent',
    'baseCurrent' | 'baseEmitterVoltage'
  >(data, ['collectorEmitterVoltage', 'collectorCurrent'], ['baseCurrent', 'baseEmitterVoltage']);
  const drive = columns.baseCurrent ?? columns.baseEmitterVoltage;
  if (drive === undefined) {
    throw invalidValue(
      ['measurements', 'baseCurrent'],
      undefined,
      "a column 'baseCurrent' or 'baseEmitterVoltage'",
    );
  }
  const byCurrent = columns.baseCurrent !== undefined;
  const minimum = options.minimumCollectorEmitterVoltage ?? 0.5;
  const ignored = new Set(unusable);
  for (let i = 0; i < count; i++) {
    if (!(Math.abs(columns.collectorEmitterVoltage[i]!) >= minimum && columns.collectorCurrent[i]! > 0))
      ignored.add(i);
  }
  const used = [...Array(count).keys()].filter((i) => !ignored.has(i));
  const vce = used.map((i) => Math.abs(columns.collectorEmitterVoltage[i]!));
  const ic = used.map((i) => columns.collectorCurrent[i]!);
  const base = used.map((i) => Math.abs(drive[i]!));
  const temperature = options.temperature ?? DEFAULT_TEMPERATURE;
  const sign = model.polarity === 'npn' ? 1 : -1;
  const given = Number(model.earlyVoltage);
  const line = straightLine(vce, ic);
  // I_C ≈ I_0·(1 + V_CE/V_A): the line's intercept over its slope, when the curve rises.
  const start =
    Number.isFinite(given) && given > 0 ? given : line.slope > 0 ? line.intercept / line.slope : 100;
  const outputCopies = new PartCopies<BjtModel>(
    vce.map((_, k) => `Q${k}`),
    (trial) => {
      const circuit = new Circuit();
      vce.forEach((v, k) => {
        circuit.voltageSource(`supply${k}`, `collector${k}`, GROUND, { dc: sign * v });
        if (byCurrent) circuit.currentSource(`drive${k}`, GROUND, `base${k}`, { dc: sign * base[k]! });
        else circuit.voltageSource(`drive${k}`, `base${k}`, GROUND, { dc: sign * base[k]! });
        circuit.bjt(`Q${k}`, { collector: `collector${k}`, base: `base${k}`, emitter: GROUND }, trial);
      });
      return circuit;
    },
  );
  const fit = fitParameters(
    [{ name: 'earlyVoltage', logarithmic: true, start: start > 0 ? start : 100 }],
    used.length,
    (values, out) => {
      const trial: BjtModel = { ...model, ...values };
      const op = outputCopies.solve(trial, { temperature, junctionConductance: FIT_JUNCTION_CONDUCTANCE });
      vce.forEach((_, k) => {
        out[k] = Math.log(op.bjt(`Q${k}`).ic / ic[k]!);
      });
      return true;
    },
    ['measurements'],
  );
  return {
    model: { ...model, ...fit.values },
    standardErrors: fit.standardErrors,
    residual: { rms: fit.rms, sumOfSquares: fit.sumOfSquares, measure: 'ln(I_model/I_measured)' },
    ignored: [...ignored].sort((a, b) => a - b),
    iterations: fit.iterations,
  };
}
