/**
 * Fitting a diode to a measured forward I-V sweep: saturation current, emission coefficient and
 * series resistance. The model is evaluated by the library's own operating-point solve (one copy of
 * the diode per measured point, each across a source at the measured voltage), so the fitted law is
 * exactly the one the builder's diode follows.
 */

import { DEFAULT_TEMPERATURE } from '../analysis/options.js';
import { Circuit } from '../circuit/circuit.js';
import { GROUND } from '../circuit/elements.js';
import type { DiodeModel } from '../devices/diode/diode-model.js';
import { thermalVoltage } from '../devices/junction.js';
import {
  FIT_JUNCTION_CONDUCTANCE,
  type FitResult,
  type FittedParameter,
  fitParameters,
  straightLine,
} from './fit-parameters.js';
import { type Measurements, readMeasurements } from './measurements.js';
import { PartCopies } from './part-copies.js';

/** Options of {@link fitDiode}. */
export interface DiodeFitOptions {
  /** The temperature of the measurement, in K (default: the operating point's); the fitted model is referred to it. */
  readonly temperature?: number;
  /**
   * Parameters held rather than fitted (numbers in SI units), e.g. `{ seriesResistance: 0 }` for a
   * sweep too low in current to show it; every other diode parameter may be given here too.
   */
  readonly fixed?: Readonly<Partial<Record<keyof DiodeModel, number>>>;
}

const FITTED = ['saturationCurrent', 'emissionCoefficient', 'seriesResistance'] as const;

/**
 * Fit I_S, n and the series resistance of a diode to a forward sweep: columns `voltage` (anode to
 * cathode at the terminals, V) and `current` (anode to cathode, A). Residuals are ln(I_model/I_measured),
 * so each decade of current weighs alike. Points with a current of 0 or less, or a value that is not a
 * finite number, are ignored.
 *
 * @param data - the sweep, as `{ voltage, current }` arrays or CSV text with those columns
 * @param options - temperature and held parameters
 * @returns the model for the builder, standard errors, the residual (in ln A) and the ignored points
 * @throws QuiescentError `invalid-value` for missing columns, unequal lengths or too few usable points
 * @example
 * ```ts
 * const fit = fitDiode({ voltage: [0.5, 0.55, 0.6, 0.65], current: [2.2e-6, 1.5e-5, 1.1e-4, 7.3e-4] },
 *   { fixed: { seriesResistance: 0 } });
 * new Circuit().diode('D1', 'a', 'gnd', fit.model);
 * ```
 */
export function fitDiode(
  data: Measurements<'voltage' | 'current'>,
  options: DiodeFitOptions = {},
): FitResult<DiodeModel> {
  const { columns, count, unusable } = readMeasurements(data, ['voltage', 'current']);
  const ignored = new Set(unusable);
  for (let i = 0; i < count; i++) if (!(columns.current[i]! > 0)) ignored.add(i);
  const used = [...Array(count).keys()].filter((i) => !ignored.has(i));
  const voltage = used.map((i) => columns.voltage[i]!);
  const current = used.map((i) => columns.current[i]!);
  const temperature = options.temperature ?? DEFAULT_TEMPERATURE;
  const fixed = options.fixed ?? {};
  const parameters = startingValues(voltage, current, thermalVoltage(temperature)).filter(
    (q) => fixed[q.name as keyof DiodeModel] === undefined,
  );
  const copies = new PartCopies<DiodeModel>(
    voltage.map((_, k) => `D${k}`),
    (model) => {
      const circuit = new Circuit();
      voltage.forEach((v, k) => {
        circuit
          .voltageSource(`sweep${k}`, `anode${k}`, GROUND, { dc: v })
          .diode(`D${k}`, `anode${k}`, GROUND, model);
      });
      return circuit;
    },
  );
  const fit = fitParameters(
    parameters,
    used.length,
    (values, out) => {
      const model = { ...fixed, ...values, referenceTemperature: temperature };
      const op = copies.solve(model, { temperature, junctionConductance: FIT_JUNCTION_CONDUCTANCE });
      current.forEach((measured, k) => {
        out[k] = Math.log(op.diode(`D${k}`).current / measured);
      });
      return true;
    },
    ['measurements'],
  );
  return {
    model: { ...fixed, ...fit.values, referenceTemperature: temperature },
    standardErrors: fit.standardErrors,
    residual: { rms: fit.rms, sumOfSquares: fit.sumOfSquares, measure: 'ln(I_model/I_measured)' },
    ignored: [...ignored].sort((a, b) => a - b),
    iterations: fit.iterations,
  };
}

/**
 * Starting values from the semilog line through the lower half of the points (where the series
 * resistance barely shows): slope 1/(n·Vt), intercept ln I_S; then the series resistance from the
 * voltage the highest point has beyond that line.
 */
function startingValues(voltage: number[], current: number[], vt: number): FittedParameter[] {
  const order = [...voltage.keys()].sort((a, b) => current[a]! - current[b]!);
  const low = order.slice(0, Math.max(2, Math.ceil(order.length / 2)));
  const line = straightLine(
    low.map((i) => voltage[i]!),
    low.map((i) => Math.log(current[i]!)),
  );
  const n = line.slope > 0 ? 1 / (line.slope * vt) : 1;
  const is = Math.exp(line.intercept);
  const top = order[order.length - 1]!;
  const excess = voltage[top]! - n * vt * Math.log(current[top]! / is + 1);
  const rs = Math.max(excess / current[top]!, 0) * 0.5 + 1e-3;
  return [
    { name: FITTED[0], logarithmic: true, start: Number.isFinite(is) && is > 0 ? is : 1e-14 },
    { name: FITTED[1], logarithmic: false, start: Number.isFinite(n) ? n : 1 },
    { name: FITTED[2], logarithmic: false, start: rs },
  ];
}
