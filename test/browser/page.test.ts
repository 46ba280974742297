/**
 * The library runs in a real browser: the example page of examples/browser, bundled by vite, opens in
 * a headless Chromium (Debian's `chromium`, driven by playwright-core) and shows the operating point,
 * the response table and the Bode plot of a divider with an RC filter, whose numbers match the closed
 * form. Slow (a build and a browser), so it runs in its own suite: `npm run test:browser`.
 */
import { existsSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { type Browser, chromium, type Page } from 'playwright-core';
import { build, type PreviewServer, preview } from 'vite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const config = fileURLToPath(new URL('../../examples/browser/vite.config.ts', import.meta.url));
/** Debian's chromium, or another build named by QUIESCENT_CHROMIUM. */
const executablePath = process.env['QUIESCENT_CHROMIUM'] ?? '/usr/bin/chromium';

// The page's circuit: 5 V through two 10 kΩ resistors, 100 nF across the lower one, 1 V of ripple.
const R_TOP = 10e3;
const R_BOTTOM = 10e3;
const C_FILTER = 100e-9;
// A divider with a capacitor across its lower leg is a first-order low-pass seen through the
// Thévenin resistance Rtop ‖ Rbottom (common practice, no source):
// H(f) = Rbottom/(Rtop + Rbottom) / (1 + j·f/fc), fc = 1/(2π·(Rtop ‖ Rbottom)·C).
const DIVIDER = R_BOTTOM / (R_TOP + R_BOTTOM);
const CORNER = 1 / (2 * Math.PI * ((R_TOP * R_BOTTOM) / (R_TOP + R_BOTTOM)) * C_FILTER);
const gainDb = (f: number) => 20 * Math.log10(DIVIDER) - 10 * Math.log10(1 + (f / CORNER) ** 2);
const phaseDegrees = (f: number) => (-Math.atan(f / CORNER) * 180) / Math.PI;

let server: PreviewServer;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  if (!existsSync(executablePath)) {
    throw new Error(`no Chromium at ${executablePath}: install Debian's chromium (bash .ci/run does)`);
  }
  await build({ configFile: config });
  server = await preview({ configFile: config, preview: { port: 0, host: '127.0.0.1', open: false } });
  const address = server.httpServer.address() as AddressInfo;
  browser = await chromium.launch({ executablePath, args: ['--no-sandbox', '--disable-gpu'] });
  page = await browser.newPage();
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  await page.goto(`http://127.0.0.1:${address.port}/`);
  await page.waitForFunction(() => document.getElementById('status')?.textContent !== 'computing…');
  expect(errors).toEqual([]);
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await new Promise<void>((resolve) => server?.httpServer.close(() => resolve()) ?? resolve());
});

/** The cells of every body row of the first table inside `selector`. */
function rows(selector: string): Promise<string[][]> {
  return page.$$eval(`${selector} table tbody tr`, (trs) =>
    trs.map((tr) => Array.from(tr.querySelectorAll('td'), (td) => td.textContent ?? '')),
  );
}

/** A number from a cell such as `-6.05 dB`, `2.5 V` or `-45.0°` (engineering prefixes: none needed here). */
function number(cell: string): number {
  return Number(cell.replace('−', '-').replace(/[^\d.eE+-].*$/, ''));
}

describe('the example page in a headless Chromium', () => {
  it('finishes without an error', async () => {
    expect(await page.textContent('#status')).toBe('ready');
  });

  it('shows the divider biasing the sensor input at half the rail', async () => {
    const nodes = await rows('#operating-point');
    const sense = nodes.find((row) => row[0] === 'sense');
    expect(sense).toBeDefined();
    expect(number(sense![1]!)).toBeCloseTo(5 * DIVIDER, 3);
    expect(sense![1]).toMatch(/ V$/);
  });

  it('tabulates the ripple gain and phase of the first-order filter a decade either side of its corner', async () => {
    const table = await rows('#response');
    expect(table).toHaveLength(3);
    [CORNER / 10, CORNER, CORNER * 10].forEach((f, k) => {
      const [, gain, phase] = table[k]!;
      // The table prints dB with two decimals and degrees with one.
      expect(Math.abs(number(gain!) - gainDb(f))).toBeLessThanOrEqual(0.005 + 1e-9);
      expect(Math.abs(number(phase!) - phaseDegrees(f))).toBeLessThanOrEqual(0.05 + 1e-9);
    });
  });

  it('draws the Bode plot as SVG, magnitude and phase in one colour, named in words', async () => {
    const plot = await page.$$eval('#plot svg path.series', (paths) =>
      paths.map((p) => ({ label: p.getAttribute('data-label'), stroke: p.getAttribute('stroke') })),
    );
    expect(plot).toHaveLength(2);
    expect(plot[0]!.label).toBe('sense ÷ rail');
    expect(plot[1]!.stroke).toBe(plot[0]!.stroke);
    const size = await page.$eval('#plot svg', (svg) => svg.getBoundingClientRect().width);
    expect(size).toBeGreaterThan(100);
  });
});
