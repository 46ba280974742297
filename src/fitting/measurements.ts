/**
 * Measured curves, given as arrays or as CSV text: columns by name, checked for length, and the
 * points that cannot be used (a value missing or not a finite number) set aside and listed.
 */
import Papa from 'papaparse';
import { invalidValue } from '../errors/messages.js';

/**
 * Measured data: an object of equally long arrays by column name (`K` required, `O` optional), or CSV
 * text with a header row.
 */
export type Measurements<K extends string, O extends string = never> =
  | (Readonly<Record<K, ArrayLike<number>>> & Readonly<Partial<Record<O, ArrayLike<number>>>>)
  | string;

/** Columns read from measurements, and the indices of the points that were not all finite numbers. */
export interface MeasuredColumns<K extends string, O extends string = never> {
  /** The required columns, and those of the optional ones that were given. */
  readonly columns: Readonly<Record<K, Float64Array>> & Readonly<Partial<Record<O, Float64Array>>>;
  /** Number of points (rows). */
  readonly count: number;
  /** Indices of points with a missing or non-finite value in one of the columns read. */
  readonly unusable: readonly number[];
}

/** A CSV heading reduced to its name: lower case, without a unit in parentheses or brackets. */
function headingName(heading: string): string {
  return heading
    .replace(/[([].*$/, '')
    .trim()
    .toLowerCase();
}

/**
 * Read the named columns. CSV text needs a header row naming them (case does not matter, and a unit
 * may follow in parentheses or brackets: `voltage (V)`); cells are plain decimal numbers. Columns in
 * `optional` may be absent (then they are not in the result).
 *
 * @throws QuiescentError `invalid-value` when a required column is missing, arrays differ in length,
 * or the data is neither an object of arrays nor text
 */
export function readMeasurements<K extends string, O extends string = never>(
  data: Measurements<K, O>,
  required: readonly K[],
  optional: readonly O[] = [],
  path: readonly (string | number)[] = ['measurements'],
): MeasuredColumns<K, O> {
  const raw: Record<string, ArrayLike<number>> = {};
  if (typeof data === 'string') {
    const parsed = Papa.parse<Record<string, string>>(data.trim(), {
      header: true,
      skipEmptyLines: 'greedy',
      transformHeader: headingName,
    });
    const fields = parsed.meta.fields ?? [];
    for (const field of fields) raw[field] = parsed.data.map((row) => cellNumber(row[field]));
  } else if (data !== null && typeof data === 'object') {
    for (const [key, value] of Object.entries(data)) raw[key] = value as ArrayLike<number>;
  } else {
    throw invalidValue(path, data, 'an object of arrays by column name, or CSV text with a header row');
  }
  const columns = {} as Record<K | O, Float64Array>;
  let count = -1;
  for (const name of [...required, ...optional] as (K | O)[]) {
    const column = raw[name];
    if (column === undefined) {
      if ((optional as readonly string[]).includes(name)) continue;
      throw invalidValue([...path, name], undefined, `a column named '${name}'`);
    }
    if (typeof column !== 'object' || typeof column.length !== 'number') {
      throw invalidValue([...path, name], column, 'an array of numbers');
    }
    if (count >= 0 && column.length !== count) {
      throw invalidValue([...path, name], column.length, `${count} values, as many as the other columns`);
    }
    count = column.length;
    columns[name] = Float64Array.from(column, (v) => (typeof v === 'number' ? v : Number.NaN));
  }
  const unusable: number[] = [];
  for (let i = 0; i < count; i++) {
    if (Object.values<Float64Array>(columns).some((c) => !Number.isFinite(c[i]!))) unusable.push(i);
  }
  return { columns, count: Math.max(count, 0), unusable };
}

/** A CSV cell as a number: NaN when empty or not a plain decimal number. */
function cellNumber(cell: string | undefined): number {
  if (cell === undefined || cell.trim() === '') return Number.NaN;
  return Number(cell);
}
