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
  AMPLIFIER_INPUT_LIMIT,
  type Caution,
  type CautionCode,
  REVERSE_BREAKDOWN_LIMIT,
} from './analysis/cautions.js';
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
export { linearSweep, logSweep, MAX_FREQUENCY, MAX_GRID_POINTS } from './analysis/frequency-grid.js';
export { type HeldReactive, holdReactive } from './analysis/held-reactive.js';
export {
  type Intermodulation,
  type IntermodulationContribution,
  type IntermodulationOptions,
  type IntermodulationProduct,
  intermodulation,
} from './analysis/intermodulation.js';
export {
  DEFAULT_LINEARITY_BUDGET,
  type DistortionShare,
  type JunctionLinearity,
  type LinearityOptions,
  type LinearityReport,
  linearity,
  type OutputLinearity,
} from './analysis/linearity.js';
export { LoopGain, type LoopGainJson, type LoopGainOptions, loopGain } from './analysis/loop-gain.js';
export {
  DENSE_LIMIT,
  type PolesOptions,
  poles,
  type Root,
  type ZerosOptions,
  zeros,
} from './analysis/natural-frequencies.js';
export { Noise, type NoiseContribution, type NoiseOptions, noise } from './analysis/noise.js';
export {
  type NoiseContributionJson,
  type NoiseFigureJson,
  type NoiseInputJson,
  type NoiseJson,
  noiseToJson,
} from './analysis/noise-json.js';
export { OperatingPoint } from './analysis/operating-point.js';
export { DEFAULT_TEMPERATURE, type OperatingPointOptions } from './analysis/options.js';
export { type Port, portImpedance } from './analysis/port-impedance.js';
export { operatingPoint, PreparedCircuit, prepareCircuit } from './analysis/prepared.js';
export {
  checkDistortion,
  DEFAULT_PHASES,
  type DistortionCheck,
  type DistortionCheckOptions,
  HARMONICS_KEPT,
  type QuasiStaticHarmonics,
  type QuasiStaticOptions,
  quasiStaticHarmonics,
  type ReactiveTreatment,
} from './analysis/quasi-static.js';
export {
  DEFAULT_TONE_PHASES,
  type QuasiStaticIntermodulation,
  type QuasiStaticIntermodulationOptions,
  type QuasiStaticProduct,
  quasiStaticIntermodulation,
} from './analysis/quasi-static-two-tone.js';
export type {
  BjtRegion,
  BjtReport,
  DeviceReport,
  DiodeReport,
  InversionLevel,
  MosfetRegion,
  MosfetReport,
  OpAmpRegion,
  OpAmpReport,
} from './analysis/reports.js';
export {
  type PassBand,
  type PassBandOptions,
  passBand,
  type ResponsePeak,
  responsePeak,
} from './analysis/resonance.js';
export {
  AcSensitivity,
  type AcSensitivityEntry,
  type AcSensitivityJson,
  type AcSensitivityOptions,
  type DcSensitivityOptions,
  type DeviceFieldOutput,
  Sensitivity,
  type SensitivityEntry,
  type SensitivityJson,
  type SensitivityOutput,
  sensitivity,
} from './analysis/sensitivity.js';
export {
  isRightHalfPlane,
  PHASE_MARGIN_TARGET,
  type RootJson,
  rootToJson,
  StabilityReport,
  type StabilityReportJson,
  type StabilityReportOptions,
  type StabilityVerdict,
  stabilityReport,
} from './analysis/stability.js';
export {
  type BjtTerminals,
  Circuit,
  type MosfetTerminals,
  type OpAmpTerminals,
  type ResistorOptions,
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
  type LoopProbeRecord,
  type MosfetRecord,
  type OpAmpRecord,
  type ResistorRecord,
  type VccsRecord,
  type VcvsRecord,
  type VoltageSourceRecord,
} from './circuit/elements.js';
export { type CircuitDocument, DOCUMENT_FORMAT, DOCUMENT_VERSION } from './circuit/json.js';
export type { BjtModel } from './devices/bjt/bjt-model.js';
export type { NoiseMechanism } from './devices/device.js';
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
  type BjtEarlyVoltageFitOptions,
  type BjtGummelFitOptions,
  type DiodeFitOptions,
  type FitResidual,
  type FitResult,
  fitBjtEarlyVoltage,
  fitBjtGummel,
  fitDiode,
  fitMosfet,
  type MeasuredColumns,
  type Measurements,
  type MosfetFitOptions,
  readMeasurements,
} from './fitting/index.js';
export {
  type AcAnalysisJson,
  type AcReportOptions,
  acAnalysisHtml,
  acAnalysisToJson,
  acTable,
  type BodeCurve,
  bodePlot,
  bodePlotSvg,
  cell,
  currentDirection,
  type DcSweepJson,
  type DcSweepReportOptions,
  DEFAULT_REPORT_DIGITS,
  type DeviceJson,
  dcSweepTable,
  dcSweepToJson,
  escapeHtml,
  formatAcAnalysis,
  formatDcSweep,
  formatMonteCarlo,
  formatOperatingPoint,
  formatWorstCase,
  type HistogramOptions,
  histogramSvg,
  htmlTable,
  type JunctionLinearityJson,
  type LinearityReportJson,
  linearityToJson,
  type MimeBundle,
  monteCarloTable,
  NOTEBOOK_DISPLAY,
  type OperatingPointJson,
  type OutputLinearityJson,
  operatingPointHtml,
  operatingPointTables,
  operatingPointToJson,
  type PhasorsJson,
  type PlotAxis,
  type PlotOptions,
  type PlotPanel,
  type PlotSeries,
  probeLabel,
  type ReportOptions,
  RichOutput,
  ratioLabel,
  renderTable,
  svgPlot,
  type TableColumn,
  type TextTable,
  type ToleranceReportOptions,
  worstCaseTable,
} from './report/index.js';
export {
  formatLinearity,
  type LinearityReportOptions,
  linearityTables,
  linearityVerdict,
} from './report/linearity-table.js';
export { loopGainPlotSvg } from './report/loop-gain-plot.js';
export { type NoisePlotOptions, noisePlotSvg } from './report/noise-plot.js';
export { formatNoise, type NoiseReportOptions, noiseTables } from './report/noise-table.js';
export { formatStabilityReport, rootsTable, stabilityTables } from './report/stability-table.js';
export {
  type AcMeasureForm,
  type CancelSignal,
  type Distribution,
  type JobHooks,
  type Measure,
  type MeasureSummary,
  MonteCarlo,
  type MonteCarloFailure,
  type MonteCarloJob,
  type MonteCarloJobOptions,
  type MonteCarloJson,
  type MonteCarloOptions,
  MonteCarloWorkers,
  type MonteCarloWorkersOptions,
  mergeMonteCarlo,
  monteCarlo,
  monteCarloJob,
  runMonteCarloJob,
  type ScriptLocation,
  type SpecLimits,
  startMonteCarloWorkers,
  type Tolerance,
  WILSON_Z,
  type WorstCase,
  type WorstCaseExtreme,
  type WorstCaseOptions,
  worstCase,
  type YieldEstimate,
} from './statistics/index.js';
export {
  DEFAULT_DIGITS,
  type FormatOptions,
  formatValue,
  parseValue,
  quantityName,
  type Unit,
  type Value,
} from './values/index.js';
