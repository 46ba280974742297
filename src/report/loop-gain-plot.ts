/**
 * A Bode plot of a loop gain with its margins marked: the 0 dB and −180° reference lines, the phase
 * margin as a bar from −180° up to the phase at the crossover, and the gain margin as a bar from the
 * magnitude at the phase crossover up to 0 dB. Drawn with the plain line plots of svg-plot.ts.
 */
import type { LoopGain } from '../analysis/loop-gain.js';
import { type PlotSeries, svgPlot } from './svg-plot.js';

const MARKS = '#c2452d';
const REFERENCE = '#888888';

/** A number for a legend: three significant digits. */
function short(value: number): string {
  return String(Number(value.toPrecision(3)));
}

/**
 * The loop gain's Bode plot as SVG, with the crossover, the phase margin and the gain margin marked.
 *
 * @param loop - the loop gain from `loopGain` (or a stability report's `loop`)
 * @param title - the title above the plot (default names the probe)
 * @returns the SVG text
 * @throws QuiescentError `invalid-value` when no frequency of the sweep is above 0
 */
export function loopGainPlotSvg(loop: LoopGain, title = `Loop gain at '${loop.probe}'`): string {
  const f = loop.frequencies;
  const ends = [f[0]!, f[f.length - 1]!];
  const magnitude: PlotSeries[] = [
    { label: '|T|', x: f, y: loop.magnitudeDb, color: '#1f5fa8' },
    { label: '0 dB', x: ends, y: [0, 0], color: REFERENCE },
  ];
  const phase: PlotSeries[] = [
    { label: 'arg T', x: f, y: loop.phaseDegrees, color: '#1f5fa8' },
    { label: '−180°', x: ends, y: [-180, -180], color: REFERENCE },
  ];
  if (loop.crossoverFrequency !== null && loop.phaseMargin !== null) {
    const fc = loop.crossoverFrequency;
    phase.push({
      label: `phase margin ${short(loop.phaseMargin)}° at ${short(fc)} Hz`,
      x: [fc, fc],
      y: [-180, loop.phaseMargin - 180],
      color: MARKS,
    });
  }
  if (loop.phaseCrossoverFrequency !== null && loop.gainMargin !== null) {
    const f180 = loop.phaseCrossoverFrequency;
    magnitude.push({
      label: `gain margin ${short(loop.gainMargin)} dB at ${short(f180)} Hz`,
      x: [f180, f180],
      y: [-loop.gainMargin, 0],
      color: MARKS,
    });
  }
  return svgPlot({
    title,
    x: { label: 'frequency', unit: 'Hz', scale: 'log' },
    panels: [
      { y: { label: 'loop gain', unit: 'dB' }, series: magnitude },
      { y: { label: 'phase', unit: '°' }, series: phase },
    ],
  });
}
