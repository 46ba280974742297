/**
 * Line plots as standalone SVG text, with no dependency: stacked panels sharing one x axis, linear or
 * logarithmic axes, gridlines at round values, tick labels in engineering notation and axis titles
 * with units. Enough for a Bode plot or a DC-sweep curve in a report or a notebook.
 */
import type { BodeTable } from '../analysis/ac-analysis.js';
import { requireOptions, requireShape } from '../errors/arguments.js';
import { invalidValue, wrongArgument } from '../errors/messages.js';
import { formatValue } from '../values/format.js';
import type { Unit } from '../values/units.js';

/** An axis: its title, its unit and its scale. */
export interface PlotAxis {
  /** The axis title, such as `'frequency'` or `'gain'`. */
  readonly label: string;
  /** The unit of its values: an SI unit (tick labels take prefixes), `'dB'` or `'°'` (plain numbers). */
  readonly unit?: Unit | 'dB' | '°';
  /** `'linear'` (default) or `'log'` (every value must then be > 0). */
  readonly scale?: 'linear' | 'log';
  /** The lower end of the axis (default: the data's, rounded out to a tick). */
  readonly min?: number;
  /** The upper end of the axis (default: the data's, rounded out to a tick). */
  readonly max?: number;
}

/** One curve: its points and its legend label. */
export interface PlotSeries {
  /** The legend label. */
  readonly label: string;
  /** The x values, one per point. */
  readonly x: ArrayLike<number>;
  /** The y values, one per point; non-finite values break the line. */
  readonly y: ArrayLike<number>;
  /** A CSS colour (default from the palette). */
  readonly color?: string;
}

/** One panel: a y axis and its curves. Panels are stacked and share the x axis. */
export interface PlotPanel {
  /** The panel's y axis. */
  readonly y: PlotAxis;
  /** The curves drawn in the panel. */
  readonly series: readonly PlotSeries[];
}

/** A whole figure. */
export interface PlotOptions {
  /** The title above the plot. */
  readonly title: string;
  /** The shared x axis. */
  readonly x: PlotAxis;
  /** The panels, top to bottom. */
  readonly panels: readonly PlotPanel[];
  /** Width of the figure in px (default 720). */
  readonly width?: number;
  /** Height of each panel's plotting area in px (default 240). */
  readonly panelHeight?: number;
}

const PALETTE = ['#1f5fa8', '#c2452d', '#2e8540', '#7a4fa3', '#b07d10', '#0f7c86'];
const FONT = 'font-family="system-ui, -apple-system, Segoe UI, sans-serif"';
const MARGIN = { left: 78, right: 24, top: 44, bottom: 54, gap: 46 };

/** Escape text for XML. */
function escapeXml(text: string): string {
  return text.replace(/[<>&"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** Round numbers: a short decimal. */
function shortNumber(value: number): string {
  return String(Number(value.toPrecision(4)));
}

/** A tick label in the axis's unit. */
function tickLabel(value: number, axis: PlotAxis): string {
  if (axis.unit === 'dB' || axis.unit === '°' || axis.unit === undefined) {
    return axis.unit === undefined ? formatValue(value, undefined, { digits: 4 }) : shortNumber(value);
  }
  return formatValue(value, axis.unit, { digits: 4 });
}

/** The axis title with its unit: `frequency (Hz)`. */
function axisTitle(axis: PlotAxis): string {
  return axis.unit === undefined ? axis.label : `${axis.label} (${axis.unit})`;
}

/** Ticks and the range they span. */
interface Ticks {
  readonly min: number;
  readonly max: number;
  readonly major: number[];
  readonly minor: number[];
}

/** A step of 1, 2 or 5 times a power of ten giving about `count` intervals over `span`. */
function niceStep(span: number, count: number): number {
  const raw = span / count;
  const power = 10 ** Math.floor(Math.log10(raw));
  const fraction = raw / power;
  return (fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10) * power;
}

function linearTicks(lo: number, hi: number, axis: PlotAxis): Ticks {
  if (lo === hi) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= pad;
    hi += pad;
  }
  const step = niceStep(hi - lo, 6);
  const min = axis.min ?? Math.floor(lo / step + 1e-9) * step;
  const max = axis.max ?? Math.ceil(hi / step - 1e-9) * step;
  const major: number[] = [];
  for (let v = Math.ceil(min / step - 1e-9) * step; v <= max + step * 1e-9; v += step) {
    major.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  }
  return { min, max, major, minor: [] };
}

function logTicks(lo: number, hi: number, axis: PlotAxis): Ticks {
  const min = axis.min ?? 10 ** Math.floor(Math.log10(lo) + 1e-9);
  let max = axis.max ?? 10 ** Math.ceil(Math.log10(hi) - 1e-9);
  if (max <= min) max = min * 10;
  const major: number[] = [];
  const minor: number[] = [];
  for (let decade = Math.floor(Math.log10(min)); decade <= Math.ceil(Math.log10(max)); decade++) {
    const base = 10 ** decade;
    if (base >= min * (1 - 1e-9) && base <= max * (1 + 1e-9)) major.push(base);
    for (let m = 2; m <= 9; m++) {
      const v = m * base;
      if (v > min && v < max) minor.push(v);
    }
  }
  return { min, max, major, minor };
}

/** The finite data range of some arrays (positive values only on a log axis). */
function dataRange(arrays: readonly ArrayLike<number>[], log: boolean, what: string): [number, number] {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const a of arrays) {
    for (let i = 0; i < a.length; i++) {
      const v = a[i]!;
      if (!Number.isFinite(v) || (log && v <= 0)) continue;
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  }
  if (lo > hi)
    throw invalidValue([what], 'no data', log ? 'some finite values above 0' : 'some finite values');
  return [lo, hi];
}

function ticksFor(axis: PlotAxis, arrays: readonly ArrayLike<number>[], what: string): Ticks {
  const log = axis.scale === 'log';
  const [lo, hi] = dataRange(arrays, log, what);
  return log ? logTicks(lo, hi, axis) : linearTicks(lo, hi, axis);
}

/** Maps values of an axis to pixels between `from` and `to`. */
function mapper(ticks: Ticks, log: boolean, from: number, to: number): (v: number) => number {
  const t = (v: number) => (log ? Math.log10(v) : v);
  const a = t(ticks.min);
  const b = t(ticks.max);
  return (v) => from + ((t(v) - a) / (b - a)) * (to - from);
}

/**
 * Draws stacked line plots as a standalone SVG document.
 *
 * @param options - title, shared x axis, panels (each a y axis and its curves), size
 * @returns the SVG text
 * @throws QuiescentError `invalid-value` when an axis has no data to show (no finite values, or none
 *   above 0 on a log axis), or a series' x and y differ in length
 * @example
 * ```ts
 * const svg = svgPlot({
 *   title: 'Output against control voltage',
 *   x: { label: 'control', unit: 'V' },
 *   panels: [{ y: { label: 'output', unit: 'V' }, series: [{ label: 'v(out)', x: [0, 1, 2], y: [0, 0.5, 0.8] }] }],
 * });
 * ```
 */
export function svgPlot(options: PlotOptions): string {
  requireOptions(options, 'options', false);
  if (!Array.isArray(options.panels as unknown))
    throw wrongArgument('options.panels', options.panels, 'an array of panels');
  const width = options.width ?? 720;
  const panelHeight = options.panelHeight ?? 240;
  const panels = options.panels;
  const height = MARGIN.top + panels.length * panelHeight + (panels.length - 1) * MARGIN.gap + MARGIN.bottom;
  const left = MARGIN.left;
  const right = width - MARGIN.right;
  for (const [p, panel] of panels.entries()) {
    for (const [s, series] of panel.series.entries()) {
      if (series.x.length !== series.y.length) {
        throw invalidValue(
          ['panels', p, 'series', s],
          series.label,
          'a series with as many x values as y values',
        );
      }
    }
  }
  const xLog = options.x.scale === 'log';
  const xTicks = ticksFor(
    options.x,
    panels.flatMap((p) => p.series.map((s) => s.x)),
    'x',
  );
  const xPixel = mapper(xTicks, xLog, left, right);
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" ${FONT}>`,
    `<rect width="${width}" height="${height}" fill="#ffffff"/>`,
    `<text x="${left}" y="26" font-size="16" font-weight="600" fill="#222">${escapeXml(options.title)}</text>`,
  ];
  let colour = 0;
  panels.forEach((panel, index) => {
    const top = MARGIN.top + index * (panelHeight + MARGIN.gap);
    const bottom = top + panelHeight;
    const yLog = panel.y.scale === 'log';
    const yTicks = ticksFor(
      panel.y,
      panel.series.map((s) => s.y),
      `panels[${index}].y`,
    );
    const yPixel = mapper(yTicks, yLog, bottom, top);
    const grid = (x1: number, y1: number, x2: number, y2: number, major: boolean) =>
      `<line x1="${x1.toFixed(1)}" y1="${y1.toFixed(1)}" x2="${x2.toFixed(1)}" y2="${y2.toFixed(1)}" stroke="${major ? '#d0d4da' : '#eceef1'}" stroke-width="1"/>`;
    for (const v of xTicks.minor) out.push(grid(xPixel(v), top, xPixel(v), bottom, false));
    for (const v of yTicks.minor) out.push(grid(left, yPixel(v), right, yPixel(v), false));
    for (const v of xTicks.major) out.push(grid(xPixel(v), top, xPixel(v), bottom, true));
    for (const v of yTicks.major) {
      out.push(grid(left, yPixel(v), right, yPixel(v), true));
      out.push(
        `<text x="${left - 8}" y="${(yPixel(v) + 4).toFixed(1)}" font-size="11" text-anchor="end" fill="#444">${escapeXml(tickLabel(v, panel.y))}</text>`,
      );
    }
    out.push(
      `<rect x="${left}" y="${top}" width="${right - left}" height="${panelHeight}" fill="none" stroke="#888" stroke-width="1"/>`,
    );
    const yMid = (top + bottom) / 2;
    out.push(
      `<text x="16" y="${yMid}" font-size="12" text-anchor="middle" fill="#222" transform="rotate(-90 16 ${yMid})">${escapeXml(axisTitle(panel.y))}</text>`,
    );
    // x tick labels under every panel, so that each reads on its own.
    for (const v of xTicks.major) {
      out.push(
        `<text x="${xPixel(v).toFixed(1)}" y="${bottom + 16}" font-size="11" text-anchor="middle" fill="#444">${escapeXml(tickLabel(v, options.x))}</text>`,
      );
    }
    out.push(
      `<clipPath id="panel${index}"><rect x="${left}" y="${top}" width="${right - left}" height="${panelHeight}"/></clipPath>`,
    );
    // A legend box in the top right corner, wide enough for the longest label.
    const longest = panel.series.reduce((w, series) => Math.max(w, [...series.label].length), 0);
    const legendWidth = 40 + longest * 6.5;
    out.push(
      `<rect x="${(right - legendWidth - 8).toFixed(1)}" y="${top + 4}" width="${legendWidth.toFixed(1)}" height="${8 + panel.series.length * 16}" fill="#ffffff" fill-opacity="0.85" stroke="#d0d4da"/>`,
    );
    panel.series.forEach((series, s) => {
      const color = series.color ?? PALETTE[colour++ % PALETTE.length]!;
      const path: string[] = [];
      let pen = 'M';
      for (let i = 0; i < series.x.length; i++) {
        const x = series.x[i]!;
        const y = series.y[i]!;
        if (!Number.isFinite(x) || !Number.isFinite(y) || (xLog && x <= 0) || (yLog && y <= 0)) {
          pen = 'M';
          continue;
        }
        path.push(`${pen}${xPixel(x).toFixed(2)},${yPixel(y).toFixed(2)}`);
        pen = 'L';
      }
      out.push(
        `<path d="${path.join(' ')}" fill="none" stroke="${color}" stroke-width="2" stroke-linejoin="round" clip-path="url(#panel${index})"/>`,
      );
      const legendY = top + 16 + s * 16;
      out.push(
        `<line x1="${(right - legendWidth).toFixed(1)}" y1="${legendY - 4}" x2="${(right - legendWidth + 22).toFixed(1)}" y2="${legendY - 4}" stroke="${color}" stroke-width="2"/>`,
        `<text x="${(right - legendWidth + 28).toFixed(1)}" y="${legendY}" font-size="11" fill="#222">${escapeXml(series.label)}</text>`,
      );
    });
  });
  const lastBottom = MARGIN.top + panels.length * panelHeight + (panels.length - 1) * MARGIN.gap;
  out.push(
    `<text x="${(left + right) / 2}" y="${lastBottom + 40}" font-size="12" text-anchor="middle" fill="#222">${escapeXml(axisTitle(options.x))}</text>`,
    '</svg>',
  );
  return out.join('\n');
}

/**
 * A Bode plot as SVG: magnitude in dB above, phase in degrees below, against frequency on a log axis.
 *
 * @param bode - the table from `AcAnalysis.bode`
 * @param title - the title above the plot
 * @param label - the legend label of the curve (default `'response'`)
 * @returns the SVG text
 * @throws QuiescentError `invalid-value` when no frequency is above 0
 */
export function bodePlotSvg(bode: BodeTable, title: string, label = 'response'): string {
  requireShape(bode, 'bode', 'a BodeTable (the result of ac.bode(output))', [
    'frequencies',
    'magnitudeDb',
    'phaseDegrees',
  ]);
  return svgPlot({
    title,
    x: { label: 'frequency', unit: 'Hz', scale: 'log' },
    panels: [
      {
        y: { label: 'magnitude', unit: 'dB' },
        series: [{ label, x: bode.frequencies, y: bode.magnitudeDb }],
      },
      { y: { label: 'phase', unit: '°' }, series: [{ label, x: bode.frequencies, y: bode.phaseDegrees }] },
    ],
  });
}
