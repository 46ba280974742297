import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { Circuit, GROUND, logSweep, operatingPoint } from '../../src/index.js';
import { bodePlotSvg, svgPlot } from '../../src/report/svg-plot.js';

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
    const paths = [...svg.matchAll(/<path d="([^"]*)"/g)].map((m) => m[1]!);
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
  it('stacks magnitude in dB over phase in degrees against a log frequency axis', () => {
    const ac = acAnalysis(
      operatingPoint(
        new Circuit()
          .voltageSource('Vin', 'in', GROUND, { ac: 1 })
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
