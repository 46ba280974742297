import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runDemo } from '../../demo/run.js';

describe('the demo', () => {
  const lines: string[] = [];
  const result = runDemo(mkdtempSync(join(tmpdir(), 'quiescent-demo-')), (text) => lines.push(text));

  // The section titles the library's text reports print (common practice, no source).
  it('prints the operating point, the AC table and the linearity report', () => {
    const text = lines.join('\n');
    expect(text).toContain('Node voltages (to ground)');
    expect(text).toContain('Small-signal gain relative to v(electrode)');
    expect(text).toContain('Junction linearity');
    expect(text).toContain('Linearity at v(detector)');
    expect(text).toMatch(/Linear enough at v\(detector\)/);
  });

  it('writes a Bode plot and a sweep plot as SVG', () => {
    expect(result.files).toHaveLength(2);
    for (const file of result.files)
      expect(readFileSync(file, 'utf8')).toMatch(/^<svg [^>]*>[\s\S]*<\/svg>$/);
  });

  it('has a pass band around 1 kHz and a level that falls as the control current rises', () => {
    // A diode's r_d = n·Vt/I_D falls with its current, so the divider it closes attenuates more
    // (Sedra & Smith, Microelectronic Circuits, 7th ed., 2015, §4.3; from memory).
    expect(result.corners.length).toBe(2);
    expect(result.corners[0]!).toBeLessThan(1e3);
    expect(result.corners[1]!).toBeGreaterThan(1e3);
    const gains = result.sweep.gainDb;
    for (let k = 1; k < gains.length; k++) expect(gains[k]!).toBeLessThan(gains[k - 1]!);
  });
});
