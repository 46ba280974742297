/**
 * A histogram of one Monte Carlo measure as standalone SVG, with the specification limits marked:
 * equal bins over the values (and the limits, so both always show), counts on the y axis, the limits
 * as dashed vertical lines labelled with their values, and the yield in the title when limits are given.
 */
import { requireOptions, requireShape } from '../errors/arguments.js';
import { invalidValue } from '../errors/messages.js';
import type { MonteCarlo, SpecLimits } from '../statistics/monte-carlo-result.js';
import { formatValue } from '../values/format.js';
import type { Unit } from '../values/units.js';

/** Options of {@link histogramSvg}. */
export interface HistogramOptions {
  /** The title (default: the measure's name, with the yield when limits are given). */
  readonly title?: string;
  /** The measure's unit, for the axis labels. */
  readonly unit?: Unit;
  /** Specification limits to mark. */
  readonly spec?: SpecLimits;
  /** The number of bins (default √n, between 5 and 60). */
  readonly bins?: number;
  /** Width in px (default 720). */
  readonly width?: number;
  /** Height in px (default 360). */
  readonly height?: number;
}

const MARGIN = { top: 44, right: 24, bottom: 52, left: 64 };
const FONT = 'font-family="system-ui, -apple-system, Segoe UI, sans-serif"';

/**
 * The histogram of measure `name` of a Monte Carlo result, as SVG text.
 *
 * @throws QuiescentError `invalid-value` for a name that is not a measure, a measure with no solved
 *   sample, or a bin count that is not a whole number from 1 to 1000
 * @example
 * ```ts
 * const svg = histogramSvg(mc, 'out', { unit: 'V', spec: { min: 2.4, max: 2.6 } });
 * ```
 */
export function histogramSvg(mc: MonteCarlo, name: string, options: HistogramOptions = {}): string {
  requireShape(mc, 'mc', 'a MonteCarlo result (of monteCarlo or mergeMonteCarlo)', ['values', 'measures']);
  requireOptions(options);
  if (typeof name !== 'string' || !Object.hasOwn(mc.values, name)) {
    throw invalidValue(['measure'], name, `a measure (${mc.measures.join(', ')})`);
  }
  const values = mc.values[name];
  if (values === undefined) throw invalidValue(['measure'], name, `a measure (${mc.measures.join(', ')})`);
  const n = values.length;
  if (n === 0) throw invalidValue(['measure'], name, 'a measure with at least one solved sample');
  const bins = options.bins ?? Math.min(60, Math.max(5, Math.ceil(Math.sqrt(n))));
  if (!Number.isInteger(bins) || bins < 1 || bins > 1000) {
    throw invalidValue(['options', 'bins'], bins, 'a whole number of bins from 1 to 1000');
  }
  const spec = options.spec ?? {};
  let low = mc.summary[name]!.min;
  let high = mc.summary[name]!.max;
  for (const limit of [spec.min, spec.max]) {
    if (limit !== undefined && Number.isFinite(limit)) {
      low = Math.min(low, limit);
      high = Math.max(high, limit);
    }
  }
  if (high === low) {
    const pad = low === 0 ? 1 : Math.abs(low) * 1e-6;
    low -= pad;
    high += pad;
  }
  const counts = new Int32Array(bins);
  const width = (high - low) / bins;
  for (let k = 0; k < n; k++) counts[Math.min(bins - 1, Math.floor((values[k]! - low) / width))]!++;
  const tallest = Math.max(...counts);

  const w = options.width ?? 720;
  const h = options.height ?? 360;
  const left = MARGIN.left;
  const right = w - MARGIN.right;
  const top = MARGIN.top;
  const bottom = h - MARGIN.bottom;
  const x = (v: number) => left + ((v - low) / (high - low)) * (right - left);
  const y = (c: number) => bottom - (c / tallest) * (bottom - top);
  const label = (v: number) => formatValue(v, options.unit, { digits: 4 });

  let title = options.title ?? name;
  if (options.title === undefined && (spec.min !== undefined || spec.max !== undefined)) {
    const y95 = mc.yield({ [name]: spec });
    title += ` — yield ${(100 * y95.fraction).toFixed(1)} % (95 %: ${(100 * y95.low).toFixed(1)}–${(100 * y95.high).toFixed(1)} %)`;
  }
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}" ${FONT}>`,
    `<rect width="${w}" height="${h}" fill="#ffffff"/>`,
    `<text x="${left}" y="26" font-size="16" font-weight="600" fill="#222">${escapeXml(title)}</text>`,
  ];
  for (let t = 0; t <= 4; t++) {
    const c = (tallest * t) / 4;
    out.push(
      `<line x1="${left}" y1="${y(c).toFixed(1)}" x2="${right}" y2="${y(c).toFixed(1)}" stroke="#eceef1"/>`,
      `<text x="${left - 8}" y="${(y(c) + 4).toFixed(1)}" font-size="11" text-anchor="end" fill="#444">${Math.round(c)}</text>`,
    );
  }
  for (let b = 0; b < bins; b++) {
    if (counts[b] === 0) continue;
    const x0 = x(low + b * width);
    const x1 = x(low + (b + 1) * width);
    out.push(
      `<rect x="${x0.toFixed(2)}" y="${y(counts[b]!).toFixed(2)}" width="${Math.max(0.5, x1 - x0 - 1).toFixed(2)}" height="${(bottom - y(counts[b]!)).toFixed(2)}" fill="#1f5fa8" fill-opacity="0.8"><title>${escapeXml(`${label(low + b * width)} to ${label(low + (b + 1) * width)}: ${counts[b]}`)}</title></rect>`,
    );
  }
  out.push(
    `<rect x="${left}" y="${top}" width="${right - left}" height="${bottom - top}" fill="none" stroke="#888"/>`,
  );
  for (let t = 0; t <= 4; t++) {
    const v = low + ((high - low) * t) / 4;
    out.push(
      `<text x="${x(v).toFixed(1)}" y="${bottom + 16}" font-size="11" text-anchor="middle" fill="#444">${escapeXml(label(v))}</text>`,
    );
  }
  for (const [key, limit] of [
    ['min', spec.min],
    ['max', spec.max],
  ] as const) {
    if (limit === undefined || !Number.isFinite(limit)) continue;
    const px = x(limit).toFixed(1);
    out.push(
      `<line class="spec-${key}" x1="${px}" y1="${top}" x2="${px}" y2="${bottom}" stroke="#c2452d" stroke-width="2" stroke-dasharray="6 4"/>`,
      `<text x="${px}" y="${top - 4}" font-size="11" text-anchor="middle" fill="#c2452d">${escapeXml(`${key} ${label(limit)}`)}</text>`,
    );
  }
  out.push(
    `<text x="${(left + right) / 2}" y="${h - 12}" font-size="12" text-anchor="middle" fill="#222">${escapeXml(`${name}${options.unit === undefined ? '' : ` (${options.unit})`}, ${n} solved samples`)}</text>`,
    `<text x="16" y="${(top + bottom) / 2}" font-size="12" text-anchor="middle" fill="#222" transform="rotate(-90 16 ${(top + bottom) / 2})">samples per bin</text>`,
    '</svg>',
  );
  return out.join('\n');
}

function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}
