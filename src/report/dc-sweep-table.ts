/** The text table of a DC sweep: one row per swept value, one column per node voltage or element current. */
import type { DcSweep, SweptQuantity } from '../analysis/dc-sweep.js';
import { probeLabel } from '../analysis/probe-label.js';
import { GROUND } from '../circuit/elements.js';
import { requireOptions, requireShape } from '../errors/arguments.js';
import type { Unit } from '../values/units.js';
import {
  cell,
  DEFAULT_REPORT_DIGITS,
  type ReportOptions,
  renderTable,
  type TableColumn,
  type TextTable,
} from './table.js';

/** Options of {@link dcSweepTable}. */
export interface DcSweepReportOptions extends ReportOptions {
  /** Nodes whose voltage to ground is shown (default every node). */
  readonly nodes?: readonly string[];
  /** Elements whose current is shown (default none). */
  readonly elements?: readonly string[];
}

/** Units of the element-level parameters a sweep can step; model parameters are shown without one. */
const PARAMETER_UNITS: Readonly<Record<string, Unit>> = {
  resistance: 'Ω',
  capacitance: 'F',
  inductance: 'H',
  transconductance: 'S',
  transresistance: 'Ω',
};

function sweptLabel(sweep: DcSweep): { header: string; unit: Unit | undefined } {
  const swept: SweptQuantity = sweep.swept;
  if (swept.kind === 'temperature') return { header: 'temperature', unit: 'K' };
  if (swept.kind === 'source') {
    const kind = sweep.points[0]?.system.deviceByName.get(swept.element)?.record.kind;
    return { header: swept.element, unit: kind === 'current-source' ? 'A' : 'V' };
  }
  return { header: `${swept.element}.${swept.parameter}`, unit: PARAMETER_UNITS[swept.parameter] };
}

/**
 * The sweep as table data: the swept value, then the chosen node voltages and element currents.
 *
 * @throws QuiescentError `unknown-node`, `unknown-element` for names the circuit lacks
 */
export function dcSweepTable(sweep: DcSweep, options: DcSweepReportOptions = {}): TextTable {
  requireShape(sweep, 'sweep', 'a DcSweep (the result of dcSweep(circuit, options))', [
    'points',
    'swept',
    'values',
  ]);
  requireOptions(options);
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  const nodes = options.nodes ?? (sweep.points[0]?.nodes ?? []).filter((n) => n !== GROUND);
  const elements = options.elements ?? [];
  const swept = sweptLabel(sweep);
  const columns: TableColumn[] = [{ header: swept.header, align: 'right' }];
  const series: { values: Float64Array; unit: Unit }[] = [];
  for (const node of nodes) {
    columns.push({ header: probeLabel(node), align: 'right' });
    series.push({ values: sweep.voltage(node), unit: 'V' });
  }
  for (const element of elements) {
    columns.push({ header: probeLabel({ element }), align: 'right' });
    series.push({ values: sweep.current(element), unit: 'A' });
  }
  const rows = Array.from(sweep.values, (value, k) => [
    cell(value, swept.unit, digits),
    ...series.map((s) => cell(s.values[k]!, s.unit, digits)),
  ]);
  return { title: `DC sweep of ${swept.header}`, columns, rows };
}

/**
 * The sweep as text, one row per swept value.
 *
 * @example
 * ```ts no-run
 * console.log(formatDcSweep(dcSweep(circuit, { source: 'control', values: linearSweep(0, 5, 11) }), { nodes: ['out'] }));
 * ```
 */
export function formatDcSweep(sweep: DcSweep, options: DcSweepReportOptions = {}): string {
  return renderTable(dcSweepTable(sweep, options));
}
