/**
 * Plain-text tables for a terminal or a notebook: a title, a header row, a rule and aligned columns.
 * Every result table of the library is drawn by {@link renderTable}, so they all look alike.
 */

import { requireShape } from '../errors/arguments.js';
import { DEFAULT_DIGITS, formatValue } from '../values/format.js';
import type { Unit } from '../values/units.js';

/** One column of a {@link TextTable}. */
export interface TableColumn {
  /** The column heading. */
  readonly header: string;
  /** `'left'` for names and words, `'right'` for numbers (default `'left'`). */
  readonly align?: 'left' | 'right';
}

/** A table as data: a title, its columns and its rows of cell text. */
export interface TextTable {
  /** The line printed above the table. */
  readonly title: string;
  /** The columns, in order. */
  readonly columns: readonly TableColumn[];
  /** The rows, each one cell text per column. */
  readonly rows: readonly (readonly string[])[];
}

/** Options shared by the text reports. */
export interface ReportOptions {
  /** Significant digits of every value, an integer from 1 to 101 (default 4, as `formatValue`). */
  readonly digits?: number;
}

/** Significant digits of report values when none are asked for: the one default of `formatValue`. */
export const DEFAULT_REPORT_DIGITS = DEFAULT_DIGITS;

/** The gap between two columns. */
const GAP = '  ';

/**
 * Draws a table as text: the title, the headings, a rule under them and one line per row, each column
 * padded to its widest cell. Lines carry no trailing spaces.
 *
 * @param table - the title, columns and rows
 * @returns the table, lines joined by `\n`, without a final newline
 * @example
 * ```ts
 * renderTable({
 *   title: 'Supply rails',
 *   columns: [{ header: 'rail' }, { header: 'voltage', align: 'right' }],
 *   rows: [['vcc', '9 V'], ['vee', '-9 V']],
 * });
 * ```
 */
export function renderTable(table: TextTable): string {
  requireShape(table, 'table', 'a TextTable (of operatingPointTables, acTable …)', [
    'title',
    'columns',
    'rows',
  ]);
  const widths = table.columns.map((column, c) =>
    table.rows.reduce((w, row) => Math.max(w, textWidth(row[c] ?? '')), textWidth(column.header)),
  );
  const line = (cells: readonly string[]): string =>
    table.columns
      .map((column, c) => pad(cells[c] ?? '', widths[c]!, column.align ?? 'left'))
      .join(GAP)
      .trimEnd();
  const rule = widths.map((w) => '─'.repeat(w)).join(GAP);
  const body = table.rows.length === 0 ? ['(none)'] : table.rows.map(line);
  return [table.title, line(table.columns.map((c) => c.header)), rule, ...body].join('\n');
}

/**
 * A value in engineering notation for a table cell: {@link formatValue} with the report's digits, and
 * `∞` or `−∞` for infinite values (an output resistance without the Early effect, say).
 *
 * @param value - the value in SI units
 * @param unit - its unit symbol, if any
 * @param digits - significant digits
 * @returns the cell text
 */
export function cell(value: number, unit: Unit | undefined, digits: number): string {
  if (value === Number.POSITIVE_INFINITY) return unit === undefined ? '∞' : `∞ ${unit}`;
  if (value === Number.NEGATIVE_INFINITY) return unit === undefined ? '−∞' : `−∞ ${unit}`;
  return formatValue(value, unit, { digits });
}

/** Characters as a terminal shows them (code points, so `µ` and `Ω` count once). */
function textWidth(text: string): number {
  return [...text].length;
}

function pad(text: string, width: number, align: 'left' | 'right'): string {
  const fill = ' '.repeat(width - textWidth(text));
  return align === 'right' ? fill + text : text + fill;
}
