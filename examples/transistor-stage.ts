/**
 * A transistor stage's gain, input impedance and output impedance.
 *
 * Scenario (invented): a vending machine's piezo knock sensor feeds a common-emitter stage on a 12 V
 * rail. The designer wants the mid-band voltage gain into the 22 kΩ comparator input, the impedance
 * the sensor sees, and the impedance the comparator sees. The coupling and bypass capacitors are
 * large, so at 10 kHz they are short circuits and the hybrid-π formulas apply:
 *   gain ≈ −g_m·(R_C ‖ r_o ‖ R_L),  Z_in ≈ R1 ‖ R2 ‖ r_π,  Z_out ≈ R_C ‖ r_o.
 * The output impedance is measured as a test engineer would: silence the input and drive the output
 * with a small AC current.
 *
 * Run: npx tsx examples/transistor-stage.ts
 */
import {
  acAnalysis,
  Circuit,
  formatOperatingPoint,
  formatValue,
  GROUND,
  operatingPoint,
} from '../src/index.js';
import { isMain } from './is-main.js';

/** The stage's parts, exported for the checks. */
export const STAGE = {
  topResistance: 68e3,
  bottomResistance: 12e3,
  collectorResistance: 5.6e3,
  emitterResistance: 1.2e3,
  loadResistance: 22e3,
  frequency: 10e3,
} as const;

/**
 * The knock-sensor stage. `probe` 'input' drives the sensor with 1 mV; 'output' silences it and
 * drives the output node with 1 µA instead.
 */
export function knockSensorStage(probe: 'input' | 'output'): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .voltageSource('sensor', 'sensor', GROUND, { ac: probe === 'input' ? '1m' : 0 })
    .capacitor('Cin', 'sensor', 'base', '22µ')
    .resistor('Rtop', 'vcc', 'base', STAGE.topResistance)
    .resistor('Rbottom', 'base', GROUND, STAGE.bottomResistance)
    .resistor('Rcollector', 'vcc', 'collector', STAGE.collectorResistance)
    .resistor('Remitter', 'emitter', GROUND, STAGE.emitterResistance)
    .capacitor('Cbypass', 'emitter', GROUND, '470µ')
    .bjt(
      'Qknock',
      { collector: 'collector', base: 'base', emitter: 'emitter' },
      {
        polarity: 'npn',
        forwardBeta: 180,
        earlyVoltage: 90,
      },
    )
    .capacitor('Cout', 'collector', 'out', '22µ')
    .resistor('Rcomparator', 'out', GROUND, STAGE.loadResistance)
    .currentSource('testCurrent', GROUND, 'out', { ac: probe === 'output' ? '1µ' : 0 });
}

/** What the stage does at 10 kHz. */
export interface StageFigures {
  /** out ÷ sensor, in V/V (negative: inverting). */
  readonly gain: number;
  /** The impedance the sensor sees, in Ω. */
  readonly inputImpedance: number;
  /** The impedance the comparator sees (the load excluded), in Ω. */
  readonly outputImpedance: number;
  /** The transistor's gm (S), rpi (Ω), ro (Ω) and region at the operating point. */
  readonly transistor: {
    readonly gm: number;
    readonly rpi: number;
    readonly ro: number;
    readonly region: string;
  };
}

/** Solve the stage and measure its gain and impedances. */
export function measureStage(): StageFigures {
  const op = operatingPoint(knockSensorStage('input'));
  const at = { frequencies: [STAGE.frequency] };
  const ac = acAnalysis(op, at);
  const gain = ac.gain('out', 'sensor')[0]!.re;
  const inputImpedance = ac.sourceImpedance('sensor')[0]!.abs();
  // Output impedance: the load in parallel with the stage, measured by the test current, then the
  // load removed: 1/Z_out = 1/Z_measured − 1/R_L.
  const acOut = acAnalysis(operatingPoint(knockSensorStage('output')), at);
  const measured = acOut.voltage('out')[0]!.abs() / 1e-6;
  const outputImpedance = 1 / (1 / measured - 1 / STAGE.loadResistance);
  const q = op.bjt('Qknock');
  return {
    gain,
    inputImpedance,
    outputImpedance,
    transistor: { gm: q.gm, rpi: q.rpi, ro: q.ro, region: q.region },
  };
}

if (isMain(import.meta.url)) {
  console.log(formatOperatingPoint(operatingPoint(knockSensorStage('input')), { digits: 3 }));
  const s = measureStage();
  console.log('');
  console.log(
    `Voltage gain at 10 kHz: ${s.gain.toFixed(2)} V/V (${(20 * Math.log10(Math.abs(s.gain))).toFixed(2)} dB)`,
  );
  console.log(`Input impedance:  ${formatValue(s.inputImpedance, 'Ω', { digits: 4 })}`);
  console.log(`Output impedance: ${formatValue(s.outputImpedance, 'Ω', { digits: 4 })}`);
}
