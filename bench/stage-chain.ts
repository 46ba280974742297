/**
 * The capacitor-coupled common-emitter chain several benchmarks share: `count` stages on one 12 V
 * supply, each with a divider bias, a coupling capacitor from the stage before and a gain near −1
 * (collector resistor equal to the unbypassed emitter resistance), so that a long chain neither
 * overflows nor underflows inside a sweep. The signal enters through 600 Ω; stage k's collector is
 * `c${k}`.
 */
import { Circuit, GROUND } from '../src/index.js';

/** Options of {@link stageChain}. */
export interface StageChainOptions {
  /** AC amplitude of the input, in V (default 1 mV). */
  readonly amplitude?: number;
  /** The transistors' flicker coefficient (default 0). */
  readonly flickerCoefficient?: number;
  /**
   * `'unbypassed'` (default): one 2.2 kΩ emitter resistor; `'split'`: 2.7 kΩ unbypassed in series
   * with 700 Ω bypassed by 100 µF (collector 2.7 kΩ either way).
   */
  readonly emitter?: 'unbypassed' | 'split';
}

/** The chain of `count` stages. */
export function stageChain(count: number, options: StageChainOptions = {}): Circuit {
  const model = {
    polarity: 'npn',
    forwardBeta: 150,
    earlyVoltage: 90,
    baseEmitterCapacitance: 8e-12,
    baseCollectorCapacitance: 3e-12,
    forwardTransitTime: 4e-10,
    flickerCoefficient: options.flickerCoefficient ?? 0,
  } as const;
  const c = new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .voltageSource('signal', 'in', GROUND, { ac: options.amplitude ?? 1e-3 })
    .resistor('source', 'in', 'src', 600);
  for (let k = 0; k < count; k++) {
    const from = k === 0 ? 'src' : `c${k - 1}`;
    c.capacitor(`couple${k}`, from, `b${k}`, 100e-6)
      .resistor(`biasTop${k}`, 'vcc', `b${k}`, 68e3)
      .resistor(`biasBottom${k}`, `b${k}`, GROUND, 12e3)
      .resistor(`collectorLoad${k}`, 'vcc', `c${k}`, 2.7e3)
      .bjt(`amp${k}`, { collector: `c${k}`, base: `b${k}`, emitter: `e${k}` }, model);
    if (options.emitter === 'split') {
      c.resistor(`degeneration${k}`, `e${k}`, `t${k}`, 2.7e3)
        .resistor(`emitterSet${k}`, `t${k}`, GROUND, 700)
        .capacitor(`bypass${k}`, `t${k}`, GROUND, 100e-6);
    } else {
      c.resistor(`emitterSet${k}`, `e${k}`, GROUND, 2.2e3);
    }
  }
  return c;
}

/** The median of `samples`. */
export function median(samples: readonly number[]): number {
  const sorted = samples.slice().sort((a, b) => a - b);
  const m = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[m]! : (sorted[m - 1]! + sorted[m]!) / 2;
}
