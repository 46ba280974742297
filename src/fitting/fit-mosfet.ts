/**
 * Fitting a MOSFET to measured drain currents at known gate-source and drain-source voltages: the
 * square law's threshold, gain factor and channel-length modulation from strong-inversion curves, or
 * the charge-based model (threshold, gain factor, slope factor, channel-length modulation) from a
 * sweep that reaches into weak inversion. Each model evaluation is the library's own operating-point
 * solve of one transistor copy per measured point, so the fitted law is exactly the builder's.
 */

import { DEFAULT_TEMPERATURE } from '../analysis/options.js';
import { Circuit } from '../circuit/circuit.js';
import { GROUND } from '../circuit/elements.js';
import { thermalVoltage } from '../devices/junction.js';
import type { MosfetModel } from '../devices/mosfet/mosfet-model.js';
import {
  FIT_JUNCTION_CONDUCTANCE,
  type FitResult,
  type FittedParameter,
  fitParameters,
  straightLine,
} from './fit-parameters.js';
import { type Measurements, readMeasurements } from './measurements.js';
import { PartCopies } from './part-copies.js';

/** Options of {@link fitMosfet}. */
export interface MosfetFitOptions {
  /** `'nmos'` (default) or `'pmos'`; a pmos's data is given in magnitudes (vsg, vsd, current out of the drain). */
  readonly polarity?: 'nmos' | 'pmos';
  /**
   * `'square-law'` (default): threshold, gain factor and λ, with residuals in current relative to
   * the largest measured current; `'charge-based'`: the slope factor too, with residuals
   * ln(I_model/I_measured) so that weak inversion weighs as much as strong.
   */
  readonly law?: 'square-law' | 'charge-based';
  /** The temperature of the measurement, in K (default: the operating point's); the model is referred to it. */
  readonly temperature?: number;
  /** Parameters held rather than fitted (e.g. `{ thresholdVoltage: 0.45 }`); others of the model may be given too. */
  readonly fixed?: Readonly<Partial<Record<Exclude<keyof MosfetModel, 'polarity'>, number>>>;
}

/**
 * Fit a MOSFET to points of columns `gateSourceVoltage`, `drainSourceVoltage` (V), `drainCurrent`
 * (A) and optionally `bodySourceVoltage` (V, default 0). λ is fitted only when the drain-source
 * voltage varies across the points (otherwise it is held at 0 or at `fixed`). Points with a value
 * that is not a finite number are ignored, and for the charge-based law those with a drain current
 * of 0 or less.
 *
 * @param data - the points, as arrays or CSV text with those columns
 * @param options - polarity, law, temperature and held parameters
 * @returns the model for the builder, standard errors, the residual and the ignored points
 * @throws QuiescentError `invalid-value` for missing columns, unequal lengths or too few usable points
 */
export function fitMosfet(
  data: Measurements<'gateSourceVoltage' | 'drainSourceVoltage' | 'drainCurrent', 'bodySourceVoltage'>,
  options: MosfetFitOptions = {},
): FitResult<MosfetModel> {
  const { columns, count, unusable } = readMeasurements<
    'gateSourceVoltage' | 'drainSourceVoltage' | 'drainCurrent',
    'bodySourceVoltage'
  >(data, ['gateSourceVoltage', 'drainSourceVoltage', 'drainCurrent'], ['bodySourceVoltage']);
  const law = options.law ?? 'square-law';
  const ignored = new Set(unusable);
  if (law === 'charge-based')
    for (let i = 0; i < count; i++) if (!(columns.drainCurrent[i]! > 0)) ignored.add(i);
  const used = [...Array(count).keys()].filter((i) => !ignored.has(i));
  const vgs = used.map((i) => columns.gateSourceVoltage[i]!);
  const vds = used.map((i) => columns.drainSourceVoltage[i]!);
  const id = used.map((i) => columns.drainCurrent[i]!);
  const body = columns.bodySourceVoltage;
  const vbs = used.map((i) => (body === undefined ? 0 : body[i]!));
  const polarity = options.polarity ?? 'nmos';
  const temperature = options.temperature ?? DEFAULT_TEMPERATURE;
  const fixed: Record<string, number> = { ...options.fixed };
  const varies = vds.some((v) => Math.abs(v - vds[0]!) > 1e-9);
  if (!varies && fixed.channelLengthModulation === undefined) fixed.channelLengthModulation = 0;
  const parameters = mosfetStart(vgs, id, law, thermalVoltage(temperature)).filter(
    (q) => fixed[q.name] === undefined,
  );
  const sign = polarity === 'nmos' ? 1 : -1;
  const largest = Math.max(...id.map(Math.abs));
  const copies = new PartCopies<MosfetModel>(
    vgs.map((_, k) => `sample${k}`),
    (model) => {
      const circuit = new Circuit();
      vgs.forEach((v, k) => {
        circuit
          .voltageSource(`gateDrive${k}`, `gate${k}`, GROUND, { dc: sign * v })
          .voltageSource(`drainDrive${k}`, `drain${k}`, GROUND, { dc: sign * vds[k]! })
          .voltageSource(`bodyDrive${k}`, `body${k}`, GROUND, { dc: sign * vbs[k]! })
          .mosfet(
            `sample${k}`,
            { drain: `drain${k}`, gate: `gate${k}`, source: GROUND, body: `body${k}` },
            model,
          );
      });
      return circuit;
    },
  );
  const fit = fitParameters(
    parameters,
    used.length,
    (values, out) => {
      const model: MosfetModel = { ...fixed, ...values, polarity, referenceTemperature: temperature };
      if (polarity === 'pmos') model.thresholdVoltage = -Number(model.thresholdVoltage);
      const op = copies.solve(model, { temperature, junctionConductance: FIT_JUNCTION_CONDUCTANCE });
      vgs.forEach((_, k) => {
        const predicted = op.mosfet(`sample${k}`).id;
        out[k] = law === 'charge-based' ? Math.log(predicted / id[k]!) : (predicted - id[k]!) / largest;
      });
      return true;
    },
    ['measurements'],
  );
  const model: MosfetModel = { ...fixed, ...fit.values, polarity, referenceTemperature: temperature };
  if (polarity === 'pmos') model.thresholdVoltage = -Number(model.thresholdVoltage);
  return {
    model,
    standardErrors: fit.standardErrors,
    residual: {
      rms: fit.rms,
      sumOfSquares: fit.sumOfSquares,
      measure: law === 'charge-based' ? 'ln(I_model/I_measured)' : '(I_model − I_measured)/max|I_measured|',
    },
    ignored: [...ignored].sort((a, b) => a - b),
    iterations: fit.iterations,
  };
}

/**
 * Starting values: the line of √I_D against V_GS through the upper third of the currents
 * (√(β/2) or √(β/(2n)) its slope, the threshold where it crosses zero); for the charge-based law the
 * slope factor from the semilog line through the lower third, 1/(n·Vt) its slope.
 */
function mosfetStart(
  vgs: number[],
  id: number[],
  law: 'square-law' | 'charge-based',
  vt: number,
): FittedParameter[] {
  const order = [...vgs.keys()].sort((a, b) => id[a]! - id[b]!);
  const third = Math.max(2, Math.ceil(order.length / 3));
  const high = order.slice(-third);
  const root = straightLine(
    high.map((i) => vgs[i]!),
    high.map((i) => Math.sqrt(Math.max(id[i]!, 0))),
  );
  const threshold = root.slope > 0 ? -root.intercept / root.slope : 0.5;
  let n = 1.5;
  if (law === 'charge-based') {
    const low = order.slice(0, third);
    const line = straightLine(
      low.map((i) => vgs[i]!),
      low.map((i) => Math.log(id[i]!)),
    );
    const estimate = line.slope > 0 ? 1 / (line.slope * vt) : 1.5;
    n = estimate > 1.05 && estimate < 5 ? estimate : 1.5;
  }
  const slope = root.slope > 0 ? root.slope : 0.01;
  const beta = law === 'charge-based' ? 2 * n * slope * slope : 2 * slope * slope;
  const parameters: FittedParameter[] = [
    { name: 'thresholdVoltage', logarithmic: false, start: threshold },
    { name: 'gainFactor', logarithmic: true, start: beta },
    { name: 'channelLengthModulation', logarithmic: false, start: 0.01 },
  ];
  if (law === 'charge-based') parameters.push({ name: 'slopeFactor', logarithmic: false, start: n });
  return parameters;
}
