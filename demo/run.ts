/**
 * The built-in example: the front end of an invented greenhouse leaf-wetness sensor. A common-emitter
 * stage amplifies the electrode signal; a diode, biased by a control current, sets the level that
 * reaches the detector. This script solves its operating point, its small-signal response over
 * frequency, the linearity verdict at the detector at the signal applied, and the level against the control
 * current, and writes a Bode plot and a sweep plot as SVG files.
 *
 * Run with `npm run demo`; the plots go to out/demo (or the folder given as the first argument).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import {
  acAnalysis,
  bodePlotSvg,
  Circuit,
  dcSweep,
  formatAcAnalysis,
  formatLinearity,
  formatOperatingPoint,
  formatValue,
  GROUND,
  linearity,
  linearSweep,
  logSweep,
  operatingPoint,
  probeLabel,
  ratioLabel,
  svgPlot,
} from '../src/index.js';

/** The sensor front end, with the level-control current as a parameter. */
export function leafWetnessFrontEnd(controlCurrent: number | string = '200µ'): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: '9 V' })
    .voltageSource('sensor', 'electrode', GROUND, { dc: 0, ac: '1m' })
    .capacitor('Cin', 'electrode', 'base', '1µF')
    .resistor('Rtop', 'vcc', 'base', '82k')
    .resistor('Rbottom', 'base', GROUND, '15k')
    .resistor('Rcollector', 'vcc', 'collector', '4.7k')
    .resistor('Remitter', 'emitter', GROUND, '1k')
    .capacitor('Cbypass', 'emitter', GROUND, '47µF')
    .bjt(
      'Qamp',
      { collector: 'collector', base: 'base', emitter: 'emitter' },
      {
        polarity: 'npn',
        forwardBeta: 150,
        earlyVoltage: 80,
        baseEmitterCapacitance: '12p',
        baseCollectorCapacitance: '4p',
        forwardTransitTime: '0.4n',
      },
    )
    .capacitor('Cout', 'collector', 'level', '2.2µF')
    .resistor('Rlevel', 'level', GROUND, '10k')
    .currentSource('control', 'vcc', 'shunt', { dc: controlCurrent })
    .resistor('Rshunt', 'shunt', 'detector', '10k')
    .resistor('Rfeed', 'level', 'detector', '2.2k')
    .diode('Dlevel', 'detector', GROUND, {
      saturationCurrent: '4n',
      emissionCoefficient: 1.8,
      junctionCapacitance: '2p',
    });
}

/** What the demo computes, for the smoke test and for anyone who imports it. */
export interface DemoResult {
  /** The folder the plots were written to. */
  readonly folder: string;
  /** The files written. */
  readonly files: readonly string[];
  /** Mid-band gain from electrode to detector at 1 kHz, in dB. */
  readonly gainAt1kHzDb: number;
  /** The −3 dB corners of that gain, in Hz. */
  readonly corners: readonly number[];
  /** The control currents swept, in A, and the gain to the detector at 1 kHz for each, in dB. */
  readonly sweep: { readonly current: Float64Array; readonly gainDb: Float64Array };
  /** The largest factor the electrode signal could grow by with the detector's verdict still holding. */
  readonly maxInputScale: number;
}

/** Solve everything, print the tables, write the plots into `folder`. */
export function runDemo(folder: string, print: (text: string) => void = console.log): DemoResult {
  const circuit = leafWetnessFrontEnd();
  const op = operatingPoint(circuit);
  print(formatOperatingPoint(op));

  // One point per decade for the table, ten per decade for the plot and the corners.
  const tableAc = acAnalysis(op, { frequencies: logSweep(1, 1e7, 1) });
  print('');
  print(formatAcAnalysis(tableAc, { outputs: ['collector', 'detector'], input: 'electrode' }));
  const ac = acAnalysis(op, { frequencies: logSweep(0.1, 1e8, 20) });
  const corners = ac.cutoffFrequencies('detector', 'electrode');
  const gainAt1kHzDb = acAnalysis(op, { frequencies: [1e3] }).magnitudeDb('detector', 'electrode')[0]!;
  print('');
  print(
    `Gain electrode → detector at 1 kHz: ${gainAt1kHzDb.toFixed(2)} dB; −3 dB corners: ` +
      corners.map((f) => formatValue(f, 'Hz', { digits: 3 })).join(' and '),
  );

  // The verdict is taken where the signal is read, the detector; each junction's share shows where the
  // curvature comes from (the transistor's reverse-biased collector junction contributes nothing).
  const report = linearity(ac, { output: 'detector' });
  print('');
  print(formatLinearity(report));

  // The level control: sweep the control current, and take the 1 kHz gain at each operating point.
  const currents = linearSweep(20e-6, 1e-3, 50);
  const sweep = dcSweep(circuit, { source: 'control', values: currents });
  const gainDb = Float64Array.from(
    sweep.points,
    (point) => acAnalysis(point, { frequencies: [1e3] }).magnitudeDb('detector', 'electrode')[0]!,
  );

  mkdirSync(folder, { recursive: true });
  const bodeFile = join(folder, 'bode.svg');
  writeFileSync(
    bodeFile,
    bodePlotSvg(
      ac.bode('detector', 'electrode'),
      'Leaf-wetness front end: electrode to detector',
      ratioLabel('detector', 'electrode'),
    ),
  );
  const sweepFile = join(folder, 'level-control.svg');
  writeFileSync(
    sweepFile,
    svgPlot({
      title: 'Level control: detector bias and 1 kHz gain against control current',
      x: { label: 'control current', unit: 'A' },
      panels: [
        {
          y: { label: 'detector bias', unit: 'V' },
          series: [{ label: probeLabel('detector'), x: currents, y: sweep.voltage('detector') }],
        },
        {
          y: { label: 'gain at 1 kHz', unit: 'dB' },
          series: [{ label: ratioLabel('detector', 'electrode'), x: currents, y: gainDb }],
        },
      ],
    }),
  );
  print('');
  print(`Plots written to ${bodeFile} and ${sweepFile}`);
  return {
    folder,
    files: [bodeFile, sweepFile],
    gainAt1kHzDb,
    corners,
    sweep: { current: currents, gainDb },
    maxInputScale: report.maxInputScale,
  };
}

if (
  process.argv[1] !== undefined &&
  resolve(process.argv[1]) === resolve(new URL(import.meta.url).pathname)
) {
  runDemo(resolve(process.argv[2] ?? 'out/demo'));
}
