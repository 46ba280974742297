/**
 * The operating point as text: node voltages, element currents, then one table per device kind with
 * each device's operating values and small-signal parameters, all in engineering notation.
 */
import type { OperatingPoint } from '../analysis/operating-point.js';
import type { BjtReport, DiodeReport, MosfetReport } from '../analysis/reports.js';
import { GROUND } from '../circuit/elements.js';
import { requireOptions, requireShape } from '../errors/arguments.js';
import { formatValue } from '../values/format.js';
import type { Unit } from '../values/units.js';
import { currentDirection } from './element-currents.js';
import {
  cell,
  DEFAULT_REPORT_DIGITS,
  type ReportOptions,
  renderTable,
  type TableColumn,
  type TextTable,
} from './table.js';

/** One numeric column of a device table: the report field, its heading and its unit. */
interface FieldColumn<R> {
  readonly field: keyof R & string;
  readonly header: string;
  readonly unit?: Unit;
}

/** The temperature in the heading to a hundredth of a kelvin (298.15 K), whatever the table's digits. */
const TEMPERATURE_DIGITS = 6;

const DIODE_COLUMNS: readonly FieldColumn<DiodeReport>[] = [
  { field: 'voltage', header: 'voltage', unit: 'V' },
  { field: 'current', header: 'current', unit: 'A' },
  { field: 'resistance', header: 'r_d', unit: 'Ω' },
  { field: 'capacitance', header: 'capacitance', unit: 'F' },
];

const BJT_COLUMNS: readonly FieldColumn<BjtReport>[] = [
  { field: 'vbe', header: 'vbe', unit: 'V' },
  { field: 'vce', header: 'vce', unit: 'V' },
  { field: 'ic', header: 'ic', unit: 'A' },
  { field: 'ib', header: 'ib', unit: 'A' },
  { field: 'gm', header: 'gm', unit: 'S' },
  { field: 'rpi', header: 'rpi', unit: 'Ω' },
  { field: 'ro', header: 'ro', unit: 'Ω' },
  { field: 'cpi', header: 'cpi', unit: 'F' },
  { field: 'cmu', header: 'cmu', unit: 'F' },
];

const MOSFET_COLUMNS: readonly FieldColumn<MosfetReport>[] = [
  { field: 'vgs', header: 'vgs', unit: 'V' },
  { field: 'vds', header: 'vds', unit: 'V' },
  { field: 'id', header: 'id', unit: 'A' },
  { field: 'thresholdVoltage', header: 'Vth', unit: 'V' },
  { field: 'overdrive', header: 'Vov', unit: 'V' },
  { field: 'gm', header: 'gm', unit: 'S' },
  { field: 'gds', header: 'gds', unit: 'S' },
  { field: 'gmb', header: 'gmb', unit: 'S' },
  { field: 'cgs', header: 'cgs', unit: 'F' },
  { field: 'cgd', header: 'cgd', unit: 'F' },
];

/**
 * The tables of an operating point as data, for callers that draw them their own way (HTML, say):
 * node voltages, element currents, then diodes, bipolar transistors and MOSFETs where the circuit
 * has any.
 *
 * @param op - the operating point
 * @param options - `digits`: significant digits (default 4)
 * @returns the tables, in print order
 */
export function operatingPointTables(op: OperatingPoint, options: ReportOptions = {}): TextTable[] {
  requireShape(op, 'op', 'an OperatingPoint (the result of operatingPoint(circuit))', [
    'system',
    'x',
    'voltage',
  ]);
  requireOptions(options);
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  const records = op.system.records;
  const tables: TextTable[] = [
    {
      title: 'Node voltages (to ground)',
      columns: [{ header: 'node' }, { header: 'voltage', align: 'right' }],
      rows: op.nodes.filter((n) => n !== GROUND).map((n) => [n, cell(op.voltage(n), 'V', digits)]),
    },
    {
      title: 'Element currents',
      columns: [
        { header: 'element' },
        { header: 'kind' },
        { header: 'counted' },
        { header: 'current', align: 'right' },
      ],
      rows: records.flatMap((r) => {
        const direction = currentDirection(r);
        return direction === undefined
          ? []
          : [[r.name, r.kind, direction, cell(op.current(r.name), 'A', digits)]];
      }),
    },
  ];
  const names = (kind: string) => records.filter((r) => r.kind === kind).map((r) => r.name);
  const diodes = names('diode');
  const bjts = names('bjt');
  const mosfets = names('mosfet');
  if (diodes.length > 0) {
    const reports = diodes.map((name) => op.diode(name));
    tables.push(deviceTable('Diodes', diodes, reports, DIODE_COLUMNS, false, digits));
  }
  if (bjts.length > 0) {
    const reports = bjts.map((name) => op.bjt(name));
    tables.push(deviceTable('Bipolar transistors', bjts, reports, BJT_COLUMNS, true, digits));
  }
  if (mosfets.length > 0) {
    const reports = mosfets.map((name) => op.mosfet(name));
    tables.push(deviceTable('MOSFETs', mosfets, reports, MOSFET_COLUMNS, true, digits));
  }
  return tables;
}

/**
 * The operating point as text tables in engineering notation: a heading line with the strategy,
 * iterations and temperature, the node voltages, the element currents with the direction each is
 * counted in, and a table per device kind with regions and small-signal parameters.
 *
 * @param op - the operating point
 * @param options - `digits`: significant digits (default 4)
 * @returns the report, lines joined by `\n`
 * @throws QuiescentError `invalid-value` when `digits` is not an integer from 1 to 101
 * @example
 * ```ts
 * console.log(formatOperatingPoint(operatingPoint(circuit)));
 * ```
 */
export function formatOperatingPoint(op: OperatingPoint, options: ReportOptions = {}): string {
  requireShape(op, 'op', 'an OperatingPoint (the result of operatingPoint(circuit))', [
    'system',
    'x',
    'voltage',
  ]);
  requireOptions(options);
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  const heading =
    `Operating point at ${formatValue(op.temperature, 'K', TEMPERATURE_DIGITS)} (Vt = ${formatValue(op.thermalVoltage, 'V', { digits })}), ` +
    `${op.strategy}, ${op.iterations} iteration${op.iterations === 1 ? '' : 's'}`;
  const warnings = op.warnings.map((w) => `Warning: ${w}`);
  return [heading, ...warnings, ...operatingPointTables(op, options).map(renderTable)].join('\n\n');
}

function deviceTable<R extends object>(
  title: string,
  names: readonly string[],
  reports: readonly R[],
  fields: readonly FieldColumn<R>[],
  withRegion: boolean,
  digits: number,
): TextTable {
  const columns: TableColumn[] = [{ header: 'device' }];
  if (withRegion) columns.push({ header: 'region' });
  for (const f of fields) columns.push({ header: f.header, align: 'right' });
  const rows = reports.map((report, i) => {
    const row = [names[i]!];
    if (withRegion) row.push(String((report as { readonly region?: string }).region ?? ''));
    for (const f of fields) row.push(cell(report[f.field] as number, f.unit, digits));
    return row;
  });
  return { title, columns, rows };
}
