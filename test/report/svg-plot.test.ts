import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { Circuit, GROUND, logSweep, operatingPoint } from '../../src/index.js';
import { bodePlotSvg, type PlotSeries, svgPlot } from '../../src/report/svg-plot.js';

/** A rectangle in px. */
interface Box {
  readonly x: number;
  readonly y: number;
  readonly width: number;
  readonly height: number;
}

/** The numeric attributes of the first element matching `pattern`'s tag in some SVG text. */
function box(tag: string): Box {
  const attr = (name: string) => Number(new RegExp(`\\b${name}="([-\\d.]+)"`).exec(tag)![1]);
  return { x: attr('x'), y: attr('y'), width: attr('width'), height: attr('height') };
}

/** The plotting areas (the framed rectangles) and the legend boxes of a plot. */
function layout(svg: string): { panels: Box[]; legends: Box[] } {
  const panels = [...svg.matchAll(/<rect [^>]*fill="none" stroke="#888"[^>]*>/g)].map((m) => box(m[0]));
  const legends = [...svg.matchAll(/<g class="legend"><rect [^>]*>/g)].map((m) => box(m[0]));
  return { panels, legends };
}

/** Each drawn series: its label, its colour and its points in px. */
function paths(svg: string): { label: string; color: string; points: [number, number][] }[] {
  return [...svg.matchAll(/<path class="series" data-label="([^"]*)" d="([^"]*)"[^>]*stroke="([^"]*)"/g)].map(
    (m) => ({
      label: m[1]!,
      color: m[3]!,
      points: m[2]!
        .split(' ')
        .filter((p) => p !== '')
        .map((p) => p.slice(1).split(',').map(Number) as [number, number]),
    }),
  );
}

/** The tick labels of panel `index`'s y axis, bottom to top. */
function yTicks(svg: string, index: number): number[] {
  const panel = layout(svg).panels[index]!;
  return [
    ...svg.matchAll(/<text x="[-\d.]+" y="([-\d.]+)" font-size="11" text-anchor="end"[^>]*>([^<]*)<\/text>/g),
  ]
    .filter((m) => Number(m[1]) >= panel.y && Number(m[1]) <= panel.y + panel.height + 5)
    .map((m) => Number(m[2]));
}

/** The text of every <text> element, in order. */
function texts(svg: string): string[] {
  return [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]!);
}

describe('svgPlot', () => {
  it('labels a log axis at every decade in engineering notation, with the unit in its title', () => {
    const svg = svgPlot({
      title: 'Decades',
      x: { label: 'frequency', unit: 'Hz', scale: 'log' },
      panels: [{ y: { label: 'level', unit: 'dB' }, series: [{ label: 'a', x: [10, 1e5], y: [0, -20] }] }],
    });
    const labels = texts(svg);
    // Engineering notation: SI prefixes per BIPM, SI Brochure, 9th ed., 2019, Table 7.
    for (const tick of ['10 Hz', '100 Hz', '1 kHz', '10 kHz', '100 kHz']) expect(labels).toContain(tick);
    expect(labels).toContain('frequency (Hz)');
    expect(labels).toContain('level (dB)');
  });

  it('puts linear ticks at round steps of 1, 2 or 5 times a power of ten', () => {
    // Common practice, no source: "nice" tick steps.
    const svg = svgPlot({
      title: 't',
      x: { label: 'control', unit: 'V' },
      panels: [{ y: { label: 'ratio' }, series: [{ label: 'a', x: [0, 0.93], y: [0, 1] }] }],
    });
    const labels = texts(svg);
    for (const tick of ['0 V', '200 mV', '400 mV', '600 mV', '800 mV', '1 V']) expect(labels).toContain(tick);
  });

  it('draws one path per series and breaks the line at values it cannot place', () => {
    const svg = svgPlot({
      title: 't',
      x: { label: 'x', scale: 'log' },
      panels: [
        {
          y: { label: 'y' },
          series: [
            { label: 'a', x: [1, 10, 0, 100, 1000], y: [1, 2, 3, Number.NaN, 5] },
            { label: 'b', x: [1, 1000], y: [0, 1] },
          ],
        },
      ],
    });
    const paths = [...svg.matchAll(/<path [^>]*d="([^"]*)"/g)].map((m) => m[1]!);
    expect(paths).toHaveLength(2);
    expect(paths[0]!.split(' ').map((p) => p[0])).toEqual(['M', 'L', 'M']);
  });

  it('escapes text for XML', () => {
    const svg = svgPlot({
      title: 'R1 < R2 & "C"',
      x: { label: 'x' },
      panels: [{ y: { label: 'y' }, series: [{ label: '<a>', x: [0, 1], y: [0, 1] }] }],
    });
    expect(svg).toContain('R1 &#60; R2 &#38; &#34;C&#34;');
    expect(svg).not.toContain('<a>');
  });

  it('rejects a series whose x and y differ in length, and an axis with nothing to show', () => {
    const plot = (x: number[], y: number[], scale: 'log' | 'linear') => () =>
      svgPlot({
        title: 't',
        x: { label: 'x', scale },
        panels: [{ y: { label: 'y' }, series: [{ label: 's', x, y }] }],
      });
    expect(plot([1, 2], [1], 'linear')).toThrow(expect.objectContaining({ code: 'invalid-value' }));
    expect(plot([0, -1], [1, 2], 'log')).toThrow(expect.objectContaining({ code: 'invalid-value' }));
  });
});

describe('bodePlotSvg', () => {
  const lowPass = () =>
    acAnalysis(
      operatingPoint(
        new Circuit()
          .voltageSource('drive', 'in', GROUND, { ac: 1 })
          .resistor('R1', 'in', 'mid', '1k')
          .capacitor('C1', 'mid', GROUND, '100n')
          .resistor('R2', 'mid', 'out', '10k')
          .capacitor('C2', 'out', GROUND, '10n'),
      ),
      { frequencies: logSweep(10, 1e6, 10) },
    );

  it('compares several responses, each one colour in both panels and named once', () => {
    const ac = lowPass();
    const svg = bodePlotSvg(
      [
        { label: 'mid ÷ in', bode: ac.bode('mid', 'in') },
        { label: 'out ÷ in', bode: ac.bode('out', 'in') },
      ],
      'Two-section low-pass',
    );
    const drawn = paths(svg);
    expect(drawn.map((p) => p.label)).toEqual(['mid ÷ in', 'out ÷ in', 'mid ÷ in', 'out ÷ in']);
    expect(drawn[2]!.color).toBe(drawn[0]!.color);
    expect(drawn[3]!.color).toBe(drawn[1]!.color);
    expect(layout(svg).legends).toHaveLength(1);
    // The second-order section falls to −180°: the phase ticks step by 45°.
    expect(yTicks(svg, 1)).toEqual([-180, -135, -90, -45, 0]);
  });

  it('rejects an empty list of responses', () => {
    expect(() => bodePlotSvg([], 'nothing')).toThrow(expect.objectContaining({ code: 'invalid-value' }));
  });

  it('stacks magnitude in dB over phase in degrees against a log frequency axis', () => {
    const ac = acAnalysis(
      operatingPoint(
        new Circuit()
          .voltageSource('input', 'in', GROUND, { ac: 1 })
          .resistor('R', 'in', 'out', '1k')
          .capacitor('C', 'out', GROUND, '100n'),
      ),
      { frequencies: logSweep(10, 1e6, 10) },
    );
    const svg = bodePlotSvg(ac.bode('out', 'in'), 'RC low-pass');
    const labels = texts(svg);
    expect(labels[0]).toBe('RC low-pass');
    expect(labels).toContain('magnitude (dB)');
    expect(labels).toContain('phase (°)');
    expect(labels).toContain('1 MHz');
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg.endsWith('</svg>')).toBe(true);
  });
});

describe('the legend and the colours', () => {
  // A curve that sweeps the whole plotting area corner to corner, as a legend inside would be crossed.
  const diagonal: PlotSeries = { label: 'rising', x: [0, 1, 2, 3, 4], y: [0, 1, 2, 3, 4] };
  const falling: PlotSeries = { label: 'falling', x: [0, 4], y: [4, 0] };

  it('stand to the right of the plotting area, where no curve runs', () => {
    // Common practice, no source: a legend must not hide data.
    const svg = svgPlot({
      title: 't',
      x: { label: 'x' },
      panels: [{ y: { label: 'y' }, series: [diagonal, falling] }],
    });
    const { panels, legends } = layout(svg);
    expect(legends).toHaveLength(1);
    const panel = panels[0]!;
    const legend = legends[0]!;
    expect(legend.x).toBeGreaterThan(panel.x + panel.width);
    for (const path of paths(svg)) {
      for (const [x] of path.points) expect(x).toBeLessThanOrEqual(panel.x + panel.width + 1e-9);
    }
    expect(legend.x + legend.width).toBeLessThanOrEqual(720);
  });

  it('give a series one colour in every panel and name it once', () => {
    const svg = svgPlot({
      title: 't',
      x: { label: 'x' },
      panels: [
        { y: { label: 'top' }, series: [diagonal, falling] },
        { y: { label: 'bottom' }, series: [diagonal, falling] },
      ],
    });
    const drawn = paths(svg);
    expect(drawn.map((p) => p.label)).toEqual(['rising', 'falling', 'rising', 'falling']);
    expect(drawn[2]!.color).toBe(drawn[0]!.color);
    expect(drawn[3]!.color).toBe(drawn[1]!.color);
    expect(drawn[0]!.color).not.toBe(drawn[1]!.color);
    expect(texts(svg).filter((t) => t === 'rising')).toHaveLength(1);
  });

  it('keep a colour given for a series', () => {
    const svg = svgPlot({
      title: 't',
      x: { label: 'x' },
      panels: [{ y: { label: 'y' }, series: [{ ...diagonal, color: '#123456' }] }],
    });
    expect(paths(svg)[0]!.color).toBe('#123456');
  });
});

describe('phase axes', () => {
  const phasePlot = (lo: number, hi: number) =>
    yTicks(
      svgPlot({
        title: 't',
        x: { label: 'x' },
        panels: [{ y: { label: 'phase', unit: '°' }, series: [{ label: 'p', x: [0, 1], y: [lo, hi] }] }],
      }),
      0,
    );

  it('tick every 45° over a quarter or half turn and every 90° over a turn or more', () => {
    // Common practice, no source: phase reads in fractions of a turn.
    expect(phasePlot(-90, 0)).toEqual([-90, -45, 0]);
    expect(phasePlot(-180, 0)).toEqual([-180, -135, -90, -45, 0]);
    expect(phasePlot(-270, 0)).toEqual([-270, -180, -90, 0]);
    expect(phasePlot(-100, 10)).toEqual([-135, -90, -45, 0, 45]);
  });
});
