/**
 * The noise analysis as text: the density at every decade of the analysed range, and the generators
 * that matter most with their share of the total noise power over that range.
 */
import type { Noise } from '../analysis/noise.js';
import { invalidValue } from '../errors/messages.js';
import type { Unit } from '../values/units.js';
import {
  cell,
  DEFAULT_REPORT_DIGITS,
  type ReportOptions,
  renderTable,
  type TableColumn,
  type TextTable,
} from './table.js';

/** Options of {@link noiseTables} and {@link formatNoise}. */
export interface NoiseReportOptions extends ReportOptions {
  /** How many contributors to list, the largest first (default 5). */
  readonly top?: number;
}

/** The unit of the output density: A for an element-current output, V otherwise (per √Hz). */
export function noiseOutputUnit(nz: Noise): Unit {
  return typeof nz.output === 'object' && 'element' in nz.output ? 'A' : 'V';
}

/** The input source's unit (per √Hz): V for a voltage source, A for a current source. */
export function noiseInputUnit(nz: Noise): Unit {
  const record =
    nz.input === undefined ? undefined : nz.operatingPoint.system.deviceByName.get(nz.input)?.record;
  return record?.kind === 'current-source' ? 'A' : 'V';
}

/** A contribution's name: element, mechanism and terminal. */
export function contributionLabel(c: { element: string; mechanism: string; terminal?: string }): string {
  return c.terminal === undefined
    ? `${c.element} ${c.mechanism}`
    : `${c.element} ${c.mechanism} (${c.terminal})`;
}

/** The analysed frequencies' range: the lowest and the highest. */
function rangeOf(frequencies: Float64Array): [number, number] {
  let low = Infinity;
  let high = 0;
  for (const f of frequencies) {
    low = Math.min(low, f);
    high = Math.max(high, f);
  }
  return [low, high];
}

/** √(PSD) of `density` at f, on the log-log line between the analysed frequencies around it. */
function densityAt(nz: Noise, density: Float64Array, f: number): number {
  let below = -1;
  let above = -1;
  nz.frequencies.forEach((g, k) => {
    if (g <= f && (below < 0 || g > nz.frequencies[below]!)) below = k;
    if (g >= f && (above < 0 || g < nz.frequencies[above]!)) above = k;
  });
  const f1 = nz.frequencies[below]!;
  const f2 = nz.frequencies[above]!;
  const d1 = density[below]!;
  const d2 = density[above]!;
  if (f2 === f1 || !(d1 > 0) || !(d2 > 0)) return f2 === f1 ? d1 : d1 + ((d2 - d1) * (f - f1)) / (f2 - f1);
  return d1 * (f / f1) ** (Math.log(d2 / d1) / Math.log(f2 / f1));
}

/**
 * The noise as two tables: the densities at each decade (1, 10, 100 … Hz) inside the analysed range
 * (its ends when it holds no decade), read on the log-log line between analysed frequencies; and the
 * `top` contributors with their RMS output noise and share of the total power over the whole range,
 * the largest RMS first.
 *
 * @param nz - the noise analysis
 * @param options - `top` (default 5) and `digits` (default 4)
 * @returns the tables as data
 * @throws QuiescentError `invalid-value` for a `top` that is not a whole number of 1 or more
 */
export function noiseTables(nz: Noise, options: NoiseReportOptions = {}): TextTable[] {
  const digits = options.digits ?? DEFAULT_REPORT_DIGITS;
  const top = options.top ?? 5;
  if (!Number.isInteger(top) || top < 1) throw invalidValue(['top'], top, 'a whole number of 1 or more');
  const [low, high] = rangeOf(nz.frequencies);
  const decades: number[] = [];
  for (let m = Math.ceil(Math.log10(low) - 1e-12); 10 ** m <= high * (1 + 1e-12); m++) {
    decades.push(Math.min(high, Math.max(low, 10 ** m)));
  }
  if (decades.length === 0) decades.push(low, high);
  const unit = noiseOutputUnit(nz);
  const columns: TableColumn[] = [
    { header: 'frequency', align: 'right' },
    { header: `output (per √Hz)`, align: 'right' },
  ];
  if (nz.inputDensity !== undefined)
    columns.push({ header: `referred to ${nz.input} (per √Hz)`, align: 'right' });
  if (nz.noiseFigure !== undefined) columns.push({ header: 'noise figure', align: 'right' });
  // The source resistor's own output density, recovered from the noise figure, interpolated like the total.
  const figure = nz.noiseFigure;
  const sourceDensity = figure?.map((db, k) => nz.outputDensity[k]! / 10 ** (db / 20));
  const rows = decades.map((f) => {
    const row = [cell(f, 'Hz', digits), cell(densityAt(nz, nz.outputDensity, f), unit, digits)];
    if (nz.inputDensity !== undefined)
      row.push(cell(densityAt(nz, nz.inputDensity, f), noiseInputUnit(nz), digits));
    if (sourceDensity !== undefined) {
      const ratio = densityAt(nz, nz.outputDensity, f) / densityAt(nz, sourceDensity, f);
      row.push(`${(20 * Math.log10(ratio)).toFixed(2)} dB`);
    }
    return row;
  });
  const densities: TextTable = { title: `Noise density at the output ${outputName(nz)}`, columns, rows };

  // A single frequency has no band to integrate over: its densities stand in for the RMS values.
  const rms =
    high > low
      ? nz.integratedContributions(low, high)
      : Float64Array.from(nz.contributions, (c) => c.density[0]!);
  let total = 0;
  for (const r of rms) total += r * r;
  const contributors: TextTable = {
    title:
      high > low
        ? `Largest contributors from ${cell(low, 'Hz', digits)} to ${cell(high, 'Hz', digits)} (total ${cell(Math.sqrt(total), unit, digits)} RMS)`
        : `Largest contributors at ${cell(low, 'Hz', digits)}`,
    columns: [
      { header: 'generator' },
      { header: high > low ? 'RMS at the output' : 'density (per √Hz)', align: 'right' },
      { header: 'share of power', align: 'right' },
    ],
    rows: Array.from(rms.keys())
      .sort((a, b) => rms[b]! - rms[a]! || a - b)
      .slice(0, top)
      .map((i) => [
        contributionLabel(nz.contributions[i]!),
        cell(rms[i]!, unit, digits),
        `${total > 0 ? ((100 * rms[i]! ** 2) / total).toFixed(1) : '0.0'} %`,
      ]),
  };
  return [densities, contributors];
}

function outputName(nz: Noise): string {
  const o = nz.output;
  if (typeof o === 'string') return `node ${o}`;
  if ('element' in o) return `current of ${o.element}`;
  return o.reference === undefined ? `node ${o.node}` : `node ${o.node} against ${o.reference}`;
}

/**
 * The noise as text: {@link noiseTables} rendered one after the other.
 *
 * @param nz - the noise analysis
 * @param options - `top` (default 5) and `digits` (default 4)
 * @returns the text, tables separated by a blank line
 * @example
 * ```ts no-run
 * console.log(formatNoise(noise(op, { output: 'out', frequencies: logSweep(10, 1e5, 10) })));
 * ```
 */
export function formatNoise(nz: Noise, options: NoiseReportOptions = {}): string {
  return noiseTables(nz, options).map(renderTable).join('\n\n');
}
