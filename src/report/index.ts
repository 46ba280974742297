export { currentDirection } from '../analysis/element-currents.js';
export {
  type DeviceJson,
  type OperatingPointJson,
  operatingPointToJson,
} from '../analysis/operating-point-json.js';
export { probeLabel, ratioLabel } from '../analysis/probe-label.js';
export {
  type AcAnalysisJson,
  acAnalysisToJson,
  type DcSweepJson,
  dcSweepToJson,
  type JunctionLinearityJson,
  type LinearityReportJson,
  linearityToJson,
  type OutputLinearityJson,
  type PhasorsJson,
} from '../analysis/result-json.js';
export { type AcReportOptions, acTable, formatAcAnalysis } from './ac-table.js';
export { type DcSweepReportOptions, dcSweepTable, formatDcSweep } from './dc-sweep-table.js';
export { type HistogramOptions, histogramSvg } from './histogram-svg.js';
export { escapeHtml, htmlTable } from './html-table.js';
export {
  formatMonteCarlo,
  formatWorstCase,
  monteCarloTable,
  type ToleranceReportOptions,
  worstCaseTable,
} from './monte-carlo-table.js';
export { formatOperatingPoint, operatingPointTables } from './operating-point-table.js';
export { acAnalysisHtml, bodePlot, operatingPointHtml } from './result-html.js';
export { type MimeBundle, NOTEBOOK_DISPLAY, RichOutput } from './rich-output.js';
export {
  type BodeCurve,
  bodePlotSvg,
  type PlotAxis,
  type PlotOptions,
  type PlotPanel,
  type PlotSeries,
  svgPlot,
} from './svg-plot.js';
export {
  cell,
  DEFAULT_REPORT_DIGITS,
  type ReportOptions,
  renderTable,
  type TableColumn,
  type TextTable,
} from './table.js';
