/**
 * A MOSFET stage: bias, gain and how large a signal it takes.
 *
 * Scenario (invented): a soil-moisture probe excites its electrodes with a 10 kHz carrier; the
 * received carrier is amplified by a common-source stage with an unbypassed source resistor. The
 * designer wants the drain bias, the gain −g_m·R_D/(1 + g_m·R_S) (source degeneration, body tied to
 * source), and the largest carrier amplitude that keeps the channel's first-order error within 5 %.
 *
 * Run: npx tsx examples/mosfet-stage.ts
 */
import {
  acAnalysis,
  Circuit,
  formatLinearity,
  formatValue,
  GROUND,
  linearity,
  operatingPoint,
} from '../src/index.js';
import { isMain } from './is-main.js';

/** The stage's parts, exported for the checks. */
export const MOSFET_STAGE = {
  drainResistance: 4.7e3,
  sourceResistance: 470,
  carrier: 10e3,
  carrierAmplitude: 20e-3,
  budget: 0.05,
} as const;

/** The common-source stage on 5 V with a 1 MΩ / 680 kΩ gate divider. */
export function moistureProbeStage(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
    .voltageSource('carrier', 'probe', GROUND, { ac: MOSFET_STAGE.carrierAmplitude })
    .capacitor('Cin', 'probe', 'gate', '1µ')
    .resistor('Rgate1', 'vdd', 'gate', '1M')
    .resistor('Rgate2', 'gate', GROUND, '680k')
    .resistor('Rdrain', 'vdd', 'drain', MOSFET_STAGE.drainResistance)
    .resistor('Rsource', 'source', GROUND, MOSFET_STAGE.sourceResistance)
    .mosfet(
      'amplifier',
      { drain: 'drain', gate: 'gate', source: 'source' },
      {
        polarity: 'nmos',
        thresholdVoltage: 1.1,
        gainFactor: '6m',
      },
    );
}

/** What the stage does. */
export interface MosfetStageFigures {
  /** The operating region, overdrive (V), drain current (A) and gm (S). */
  readonly bias: {
    readonly region: string;
    readonly overdrive: number;
    readonly id: number;
    readonly gm: number;
  };
  /** drain ÷ probe at the carrier frequency, V/V. */
  readonly gain: number;
  /** x = v̂gs/V_ov of the channel at the applied carrier. */
  readonly normalized: number;
  /** The channel's first-order error bound at the applied carrier. */
  readonly errorBound: number;
  /** The largest carrier amplitude with the channel within the budget, in V. */
  readonly maxCarrier: number;
  /** The linearity report as text. */
  readonly text: string;
}

/** Solve the stage, its gain and the linearity of its channel. */
export function analyseMosfetStage(): MosfetStageFigures {
  const op = operatingPoint(moistureProbeStage());
  const m = op.mosfet('amplifier');
  const ac = acAnalysis(op, { frequencies: [MOSFET_STAGE.carrier] });
  const report = linearity(ac, { budget: MOSFET_STAGE.budget });
  const channel = report.junctions.find((j) => j.device === 'amplifier')!;
  return {
    bias: { region: m.region, overdrive: m.overdrive, id: m.id, gm: m.gm },
    gain: ac.gain('drain', 'probe')[0]!.re,
    normalized: channel.normalized,
    errorBound: channel.errorBound,
    maxCarrier: MOSFET_STAGE.carrierAmplitude * report.maxInputScale,
    text: formatLinearity(report),
  };
}

if (isMain(import.meta.url)) {
  const s = analyseMosfetStage();
  console.log(
    `The amplifier in ${s.bias.region}: id ${formatValue(s.bias.id, 'A', { digits: 3 })}, ` +
      `V_ov ${formatValue(s.bias.overdrive, 'V', { digits: 3 })}, gm ${formatValue(s.bias.gm, 'S', { digits: 3 })}`,
  );
  console.log(`Gain at 10 kHz: ${s.gain.toFixed(3)} V/V`);
  console.log(s.text);
  console.log(`Largest carrier within the 5 % budget: ${formatValue(s.maxCarrier, 'V', { digits: 3 })} peak`);
}
