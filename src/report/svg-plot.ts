/**
 * Line plots as standalone SVG text, with no dependency: stacked panels sharing one x axis, linear or
 * logarithmic axes, gridlines at round values (phase in steps of 45° or 90°), tick labels in
 * engineering notation and axis titles with units. The legend stands to the right of the plotting
 * area, where no curve runs, and a series keeps one colour in every panel it appears in (matched by
 * its label). Enough for a Bode plot or a DC-sweep curve in a report or a notebook.
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
  /** The legend label; series with the same label in several panels share a colour and a legend entry. */
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
const MARGIN = { left: 78, right: 16, top: 44, bottom: 54, gap: 46 };
/** Space between the plotting area and the legend, and the legend's inner layout, in px. */
const LEGEND = { gap: 14, swatch: 22, padding: 8, row: 16, charWidth: 6.5 };
/** Phase steps in degrees: quarter and half turns first, then whole turns. */
const PHASE_STEPS = [45, 90, 180, 360, 720, 1440];

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

/** The smallest of 45°, 90°, 180°, … that cuts `span` into at most 4 intervals: 45° up to a half turn, 90° up to a turn. */
function phaseStep(span: number): number {
  for (const step of PHASE_STEPS) if (span / step <= 4 + 1e-9) return step;
  return niceStep(span, 6);
}

function linearTicks(lo: number, hi: number, axis: PlotAxis): Ticks {
  if (lo === hi) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= pad;
    hi += pad;
  }
  const step = axis.unit === '°' ? phaseStep(hi - lo) : niceStep(hi - lo, 6);
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

/** One colour per distinct label, in the order labels first appear: a given colour, else the palette's next. */
function seriesColours(panels: readonly PlotPanel[]): Map<string, string> {
  const colours = new Map<string, string>();
  for (const panel of panels) {
    for (const series of panel.series) {
      if (!colours.has(series.label)) {
        colours.set(series.label, series.color ?? PALETTE[colours.size % PALETTE.length]!);
      }
    }
  }
  return colours;
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
 *   panels: [{ y: { label: 'output', unit: 'V' }, series: [{ label: 'out', x: [0, 1, 2], y: [0, 0.5, 0.8] }] }],
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
  const colours = seriesColours(panels);
  const longest = [...colours.keys()].reduce((w, label) => Math.max(w, [...label].length), 0);
  const legendWidth = 2 * LEGEND.padding + LEGEND.swatch + 6 + longest * LEGEND.charWidth;
  const right = width - MARGIN.right - LEGEND.gap - legendWidth;
  if (right - left < 40) {
    throw invalidValue(
      ['width'],
      width,
      `a width that leaves room for the plot beside a ${Math.ceil(legendWidth)} px legend`,
    );
  }
  const legendLeft = right + LEGEND.gap;
  const listed = new Set<string>();
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
    const legendEntries: string[] = [];
    for (const series of panel.series) {
      const color = colours.get(series.label)!;
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
        `<path class="series" data-label="${escapeXml(series.label)}" d="${path.join(' ')}" fill="none" stroke="${color}" stroke-width="2" stroke-linejoin="round" clip-path="url(#panel${index})"/>`,
      );
      if (listed.has(series.label)) continue;
      listed.add(series.label);
      const y = top + LEGEND.padding + 12 + legendEntries.length * LEGEND.row;
      const x = legendLeft + LEGEND.padding;
      legendEntries.push(
        `<line x1="${x.toFixed(1)}" y1="${y - 4}" x2="${(x + LEGEND.swatch).toFixed(1)}" y2="${y - 4}" stroke="${color}" stroke-width="2"/>`,
        `<text x="${(x + LEGEND.swatch + 6).toFixed(1)}" y="${y}" font-size="11" fill="#222">${escapeXml(series.label)}</text>`,
      );
    }
    // The legend of the labels this panel shows first, beside the panel, outside its plotting area.
    if (legendEntries.length > 0) {
      const rows = legendEntries.length / 2;
      out.push(
        `<g class="legend"><rect x="${legendLeft.toFixed(1)}" y="${top}" width="${legendWidth.toFixed(1)}" height="${2 * LEGEND.padding + rows * LEGEND.row}" fill="#ffffff" stroke="#d0d4da"/>`,
        ...legendEntries,
        '</g>',
      );
    }
  });
  const lastBottom = MARGIN.top + panels.length * panelHeight + (panels.length - 1) * MARGIN.gap;
  out.push(
    `<text x="${(left + right) / 2}" y="${lastBottom + 40}" font-size="12" text-anchor="middle" fill="#222">${escapeXml(axisTitle(options.x))}</text>`,
    '</svg>',
  );
  return out.join('\n');
}

/** One response of a Bode plot with several: its legend label and its table. */
export interface BodeCurve {
  /** The legend label, shared by its magnitude and phase curves. */
  readonly label: string;
  /** The table from `AcAnalysis.bode`. */
  readonly bode: BodeTable;
  /** A CSS colour (default from the palette). */
  readonly color?: string;
}

/**
 * A Bode plot as SVG: magnitude in dB above, phase in degrees below (ticks every 45° or 90°), against
 * frequency on a log axis. Give one table, or several labelled responses to compare them on one plot;
 * each response keeps its colour in both panels and is named once in the legend beside the magnitude
 * panel.
 *
 * @param responses - a table from `AcAnalysis.bode`, or several `{ label, bode, color? }`
 * @param title - the title above the plot
 * @param label - the legend label of a single table (default `'response'`)
 * @returns the SVG text
 * @throws QuiescentError `invalid-value` when no frequency is above 0, or the list is empty
 * @example
 * ```ts
 * const circuit = new Circuit()
 *   .voltageSource('drive', 'in', GROUND, { ac: 1 })
 *   .resistor('R1', 'in', 'out', '1k')
 *   .capacitor('C1', 'out', GROUND, '100n');
 * const ac = acAnalysis(operatingPoint(circuit), { frequencies: logSweep(10, 1e6, 10) });
 * const svg = bodePlotSvg(
 *   [
 *     { label: 'out ÷ in', bode: ac.bode('out', 'in') },
 *     { label: 'current in R1 ÷ in', bode: ac.bode({ element: 'R1' }, 'in') },
 *   ],
 *   'Low-pass filter',
 * );
 * ```
 */
export function bodePlotSvg(
  responses: BodeTable | readonly BodeCurve[],
  title: string,
  label = 'response',
): string {
  const curves: readonly BodeCurve[] = Array.isArray(responses)
    ? (responses as readonly BodeCurve[])
    : [{ label, bode: responses as BodeTable }];
  for (const [k, curve] of curves.entries()) {
    requireShape(curve, `responses[${k}]`, 'a curve { label, bode, color? }', ['label', 'bode']);
    requireShape(curve.bode, `responses[${k}].bode`, 'a BodeTable (the result of ac.bode(output))', [
      'frequencies',
      'magnitudeDb',
      'phaseDegrees',
    ]);
  }
  if (curves.length === 0) throw invalidValue(['responses'], 'an empty list', 'one response or more');
  const series = (pick: (bode: BodeTable) => Float64Array): PlotSeries[] =>
    curves.map((curve) => ({
      label: curve.label,
      x: curve.bode.frequencies,
      y: pick(curve.bode),
      ...(curve.color === undefined ? {} : { color: curve.color }),
    }));
  return svgPlot({
    title,
    x: { label: 'frequency', unit: 'Hz', scale: 'log' },
    panels: [
      { y: { label: 'magnitude', unit: 'dB' }, series: series((bode) => bode.magnitudeDb) },
      { y: { label: 'phase', unit: '°' }, series: series((bode) => bode.phaseDegrees) },
    ],
  });
}
