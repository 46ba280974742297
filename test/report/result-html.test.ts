import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { Circuit, GROUND, logSweep, operatingPoint } from '../../src/index.js';
import { acTable } from '../../src/report/ac-table.js';
import { htmlTable } from '../../src/report/html-table.js';
import { acAnalysisHtml, bodePlot, operatingPointHtml } from '../../src/report/result-html.js';
import { NOTEBOOK_DISPLAY, RichOutput } from '../../src/report/rich-output.js';

// A 9 V rail divided 2:1 by 20 kΩ over 10 kΩ, with 1 µF across the lower leg.
const op = operatingPoint(
  new Circuit()
    .voltageSource('rail', 'supply', GROUND, { dc: 9, ac: 1 })
    .resistor('Rupper', 'supply', 'tap', '20k')
    .resistor('Rlower', 'tap', GROUND, '10k')
    .capacitor('Csmooth', 'tap', GROUND, '1µ'),
);
const ac = acAnalysis(op, { frequencies: logSweep(1, 1e4, 5) });

/** The cell texts of each body row of an HTML table. */
function bodyRows(html: string): string[][] {
  const body = /<tbody>([\s\S]*?)<\/tbody>/.exec(html)![1]!;
  return [...body.matchAll(/<tr>([\s\S]*?)<\/tr>/g)].map((row) =>
    [...row[1]!.matchAll(/<td[^>]*>([^<]*)<\/td>/g)].map((cell) => cell[1]!),
  );
}

describe('htmlTable', () => {
  it('carries the title, headings and cells of the text table, numbers aligned right', () => {
    const table = acTable(ac, { outputs: ['tap'], input: 'supply' });
    const html = htmlTable(table);
    expect(html).toContain(`<caption>${table.title}</caption>`);
    expect(html).toContain('<th style="text-align:right">tap ÷ supply</th>');
    expect(bodyRows(html)).toEqual(table.rows);
  });

  it('escapes text and marks an empty table', () => {
    const html = htmlTable({ title: 'R1 < R2 & "x"', columns: [{ header: '<b>' }], rows: [] });
    expect(html).toContain('<caption>R1 &#60; R2 &#38; &#34;x&#34;</caption>');
    expect(html).not.toContain('<b>');
    expect(html).toContain('<td colspan="1">(none)</td>');
  });
});

describe('results in a notebook', () => {
  it('show an operating point as its HTML tables, with the text report as the plain stand-in', () => {
    const bundle = operatingPointHtml(op)[NOTEBOOK_DISPLAY]();
    const html = bundle['text/html']!;
    expect(html.match(/<table class="quiescent">/g)!.length).toBeGreaterThanOrEqual(2);
    // The divider: 9 V · 10 kΩ/(20 kΩ + 10 kΩ) = 3 V at the tap (Ohm's law).
    expect(bodyRows(html)).toContainEqual(['tap', '3 V']);
    expect(bundle['text/plain']).toMatch(/^Operating point at 298\.15 K/);
    expect(String(operatingPointHtml(op))).toBe(html);
  });

  it('show an AC analysis as its response table', () => {
    const bundle = acAnalysisHtml(ac)[NOTEBOOK_DISPLAY]();
    expect(bundle['text/html']).toBe(acAnalysisHtml(ac).text);
    expect(bundle['text/plain']).toContain('Small-signal response');
  });

  it('show a Bode plot as SVG from one call, titled and labelled with the probes', () => {
    const plot = bodePlot(ac, 'tap', 'supply');
    expect(plot).toBeInstanceOf(RichOutput);
    const bundle = plot[NOTEBOOK_DISPLAY]();
    expect(bundle['image/svg+xml']!.startsWith('<svg')).toBe(true);
    expect(bundle['image/svg+xml']).toContain('>Bode plot of tap ÷ supply</text>');
    expect(bundle['image/svg+xml']).toContain('data-label="tap ÷ supply"');
    expect(bundle['text/html']).toBeUndefined();
    expect(bodePlot(ac, 'tap', undefined, 'Tap').text).toContain('>Tap</text>');
  });

  it('use the symbol the notebook kernels look for', () => {
    // Deno, "Jupyter Kernel for Deno" (docs.deno.com, 2025): Deno.jupyter.$display is Symbol.for('Jupyter.display').
    expect(NOTEBOOK_DISPLAY).toBe(Symbol.for('Jupyter.display'));
  });
});
