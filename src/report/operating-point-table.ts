/**
 * The operating point as text: node voltages, element currents, then one table per device kind with
 * each device's operating values and small-signal parameters, all in engineering notation.
 */

import { currentDirection } from '../analysis/element-currents.js';
import type { OperatingPoint } from '../analysis/operating-point.js';
import { GROUND } from '../circuit/elements.js';
import type { ReportSpec } from '../devices/descriptor.js';
import { ELEMENT_KINDS, KINDS } from '../devices/registry.js';
import { requireOptions, requireShape } from '../errors/arguments.js';
import { formatValue } from '../values/format.js';
import {
  cell,
  DEFAULT_REPORT_DIGITS,
  type ReportOptions,
  renderTable,
  type TableColumn,
  type TextTable,
} from './table.js';

/** The temperature in the heading to a hundredth of a kelvin (298.15 K), whatever the table's digits. */
const TEMPERATURE_DIGITS = 6;

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
  for (const kind of ELEMENT_KINDS) {
    const spec = KINDS[kind].report;
    if (spec === null) continue;
    const names = records.filter((r) => r.kind === kind).map((r) => r.name);
    if (names.length === 0) continue;
    const reports = names.map((name) => op.device(name) as unknown as Readonly<Record<string, unknown>>);
    tables.push(deviceTable(spec, names, reports, digits));
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

function deviceTable(
  spec: ReportSpec,
  names: readonly string[],
  reports: readonly Readonly<Record<string, unknown>>[],
  digits: number,
): TextTable {
  const columns: TableColumn[] = [{ header: 'device' }];
  if (spec.withRegion) columns.push({ header: 'region' });
  for (const c of spec.columns) columns.push({ header: c.header, align: 'right' });
  const rows = reports.map((report, i) => {
    const row = [names[i]!];
    if (spec.withRegion) row.push(String(report.region ?? ''));
    for (const c of spec.columns) row.push(cell(report[c.field] as number, c.unit, digits));
    return row;
  });
  return { title: spec.title, columns, rows };
}
