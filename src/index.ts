/**
 * quiescent: circuit math in TypeScript. Build a circuit, find its DC operating point, linearize every
 * nonlinear part there, solve the small-signal AC response, and say how far from linear each junction runs.
 *
 * @packageDocumentation
 */

export {
  AcAnalysis,
  type AcAnalysisOptions,
  acAnalysis,
  type BodeTable,
  type CutoffOptions,
  type Probe,
} from './analysis/ac-analysis.js';
export {
  DcSweep,
  type DcSweepOptions,
  dcSweep,
  type ParameterSweepOptions,
  type SourceSweepOptions,
  type SweepValues,
  type SweptQuantity,
  type TemperatureSweepOptions,
} from './analysis/dc-sweep.js';
export {
  type DistortionContribution,
  type DistortionEstimate,
  type DistortionOptions,
  type DistortionPoint,
  distortion,
} from './analysis/distortion.js';
export { linearSweep, logSweep } from './analysis/frequency-grid.js';
export {
  DEFAULT_LINEARITY_BUDGET,
  type JunctionLinearity,
  type LinearityOptions,
  type LinearityReport,
  linearity,
} from './analysis/linearity.js';
export { OperatingPoint, operatingPoint } from './analysis/operating-point.js';
export { DEFAULT_TEMPERATURE, type OperatingPointOptions } from './analysis/options.js';
export { type Port, portImpedance } from './analysis/port-impedance.js';
export {
  checkDistortion,
  DEFAULT_PHASES,
  type DistortionCheck,
  type DistortionCheckOptions,
  type QuasiStaticHarmonics,
  type QuasiStaticOptions,
  quasiStaticHarmonics,
} from './analysis/quasi-static.js';
export type {
  BjtRegion,
  BjtReport,
  DeviceReport,
  DiodeReport,
  MosfetRegion,
  MosfetReport,
} from './analysis/reports.js';
export {
  type BjtTerminals,
  Circuit,
  type MosfetTerminals,
  type OpAmpTerminals,
  type SourceSpec,
} from './circuit/circuit.js';
export {
  type AcExcitation,
  type BjtRecord,
  type CapacitorRecord,
  type CccsRecord,
  type CcvsRecord,
  type CurrentSourceRecord,
  type DiodeRecord,
  type ElementKind,
  type ElementRecord,
  type GivenParameters,
  GROUND,
  type InductorRecord,
  type MosfetRecord,
  type OpAmpRecord,
  type ResistorRecord,
  type VccsRecord,
  type VcvsRecord,
  type VoltageSourceRecord,
} from './circuit/elements.js';
export { type CircuitDocument, DOCUMENT_FORMAT, DOCUMENT_VERSION } from './circuit/json.js';
export type { BjtModel } from './devices/bjt/bjt-model.js';
export type { DiodeModel } from './devices/diode/diode-model.js';
export { BOLTZMANN, ELEMENTARY_CHARGE, thermalVoltage } from './devices/junction.js';
export type { MosfetModel } from './devices/mosfet/mosfet-model.js';
export type { OpAmpOptions } from './devices/op-amp/op-amp-model.js';
export {
  type CircuitProblem,
  type DetailsOf,
  type ErrorCode,
  type ErrorDetails,
  QuiescentError,
  type ResidualEntry,
  type StrategyAttempt,
  type ValueRange,
} from './errors/quiescent-error.js';
export {
  type AcAnalysisJson,
  type AcReportOptions,
  acAnalysisToJson,
  acTable,
  bodePlotSvg,
  cell,
  currentDirection,
  type DcSweepJson,
  type DcSweepReportOptions,
  DEFAULT_REPORT_DIGITS,
  type DeviceJson,
  dcSweepTable,
  dcSweepToJson,
  formatAcAnalysis,
  formatDcSweep,
  formatOperatingPoint,
  type JunctionLinearityJson,
  type LinearityReportJson,
  linearityToJson,
  type OperatingPointJson,
  operatingPointTables,
  operatingPointToJson,
  type PhasorsJson,
  type PlotAxis,
  type PlotOptions,
  type PlotPanel,
  type PlotSeries,
  probeLabel,
  type ReportOptions,
  renderTable,
  svgPlot,
  type TableColumn,
  type TextTable,
} from './report/index.js';
export {
  formatLinearity,
  type LinearityReportOptions,
  linearityTables,
  linearityVerdict,
} from './report/linearity-table.js';
export {
  type FormatOptions,
  formatValue,
  parseValue,
  quantityName,
  type Unit,
  type Value,
} from './values/index.js';
