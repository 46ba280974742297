/**
 * The stability report as text and as a Bode plot: the margins, the poles with a right-half-plane
 * pole flagged, the verdict in words, and the margins marked on the plot.
 */
import { describe, expect, it } from 'vitest';
import {
  formatStabilityReport,
  logSweep,
  loopGain,
  loopGainPlotSvg,
  operatingPoint,
  rootsTable,
  stabilityReport,
} from '../../src/index.js';
import { threePoleLoop } from '../support/three-pole-loop.js';

const frequencies = logSweep(1e3, 1e8, 50);

describe('formatStabilityReport', () => {
  it('flags the right-half-plane poles of an unstable loop and says so', () => {
    const text = formatStabilityReport(
      stabilityReport(operatingPoint(threePoleLoop(10)), { probe: 'loopBreak', frequencies }),
    );
    expect(text).toContain("Loop gain at 'loopBreak'");
    expect(text).toContain('gain margin');
    expect(text.match(/RIGHT: grows/g)).toHaveLength(2);
    expect(text).toContain('Verdict: UNSTABLE: 2 poles in the right half-plane');
  });

  it('gives the phase margin of a stable loop in its verdict, to the digits asked for', () => {
    const report = stabilityReport(operatingPoint(threePoleLoop(1.5)), { probe: 'loopBreak', frequencies });
    const text = formatStabilityReport(report, { digits: 3 });
    expect(text).toContain(
      `Verdict: stable, phase margin ${Number(report.loop.phaseMargin!.toPrecision(3))}°.`,
    );
    expect(text).not.toContain('RIGHT');
  });
});

describe('rootsTable', () => {
  it('prints Q as ∞ on the imaginary axis and marks the root there', () => {
    const table = rootsTable('Poles', [
      { real: 0, imaginary: 1e3, frequency: 1e3, q: Infinity, dampingRatio: 0 },
    ]);
    expect(table.rows[0]).toEqual(['0 Hz', '1 kHz', '1 kHz', '∞', '0', 'on the axis']);
  });
});

describe('loopGainPlotSvg', () => {
  it('marks the crossover with the phase margin and the gain margin', () => {
    const loop = loopGain(operatingPoint(threePoleLoop(4)), { probe: 'loopBreak', frequencies });
    const svg = loopGainPlotSvg(loop);
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).toContain(`phase margin ${Number(loop.phaseMargin!.toPrecision(3))}°`);
    expect(svg).toContain(`gain margin ${Number(loop.gainMargin!.toPrecision(3))} dB`);
    expect(svg).toContain('Loop gain at &#39;loopBreak&#39;');
  });
});
