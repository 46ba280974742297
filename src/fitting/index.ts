export {
  type BjtEarlyVoltageFitOptions,
  type BjtGummelFitOptions,
  fitBjtEarlyVoltage,
  fitBjtGummel,
} from './fit-bjt.js';
export { type DiodeFitOptions, fitDiode } from './fit-diode.js';
export { fitMosfet, type MosfetFitOptions } from './fit-mosfet.js';
export type { FitResidual, FitResult } from './fit-parameters.js';
export { type MeasuredColumns, type Measurements, readMeasurements } from './measurements.js';
