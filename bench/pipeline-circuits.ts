/**
 * The three circuit families of the pipeline benchmark, each built through the public builder to
 * about a requested number of elements.
 *
 * - bipolar: capacitor-coupled common-emitter stages on a 12 V supply, each with a base divider,
 *   collector and emitter resistors, a roll-off capacitor at the collector and a coupling capacitor
 *   from the stage before (seven elements a stage). Every stage sits at the same bias, and the
 *   emitter degeneration keeps the small-signal gain of a stage near −0.4, so that the response
 *   along a long chain decays instead of overflowing.
 * - mesh: a square grid whose horizontal edges are resistors and vertical edges diodes pointing down
 *   the grid, a resistor from every node to ground, the top row fed from a supply.
 * - cmos: CMOS inverters as inverting amplifiers: an input resistor from the stage before and a
 *   feedback resistor of the same value hold each at its switching point (gain near −1), with a
 *   load capacitor at each output (five elements a stage).
 */
import { Circuit, GROUND } from '../src/index.js';

/** The names of the families. */
export type PipelineFamily = 'bipolar' | 'mesh' | 'cmos';

/** Every family, in table order. */
export const PIPELINE_FAMILIES: readonly PipelineFamily[] = ['bipolar', 'mesh', 'cmos'];

/** A family's circuit of about `elements` elements, and the node read as its output. */
export function pipelineCircuit(
  family: PipelineFamily,
  elements: number,
): { circuit: Circuit; output: string } {
  switch (family) {
    case 'bipolar':
      return bipolarStages(Math.max(1, Math.round((elements - 2) / 7)));
    case 'mesh':
      return diodeMesh(Math.max(2, Math.round(Math.sqrt(elements / 3))));
    case 'cmos':
      return cmosChain(Math.max(1, Math.round((elements - 2) / 5)));
  }
}

function bipolarStages(count: number): { circuit: Circuit; output: string } {
  const model = {
    polarity: 'npn',
    forwardBeta: 150,
    earlyVoltage: 90,
    baseEmitterCapacitance: '8p',
    baseCollectorCapacitance: '2p',
  } as const;
  const c = new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .voltageSource('tone', 'c0', GROUND, { ac: '1m' });
  for (let k = 1; k <= count; k++) {
    c.capacitor(`couple${k}`, `c${k - 1}`, `b${k}`, '1µ')
      .resistor(`biasTop${k}`, 'vcc', `b${k}`, '47k')
      .resistor(`biasBottom${k}`, `b${k}`, GROUND, '10k')
      .bjt(`amp${k}`, { collector: `c${k}`, base: `b${k}`, emitter: `e${k}` }, model)
      .resistor(`collectorLoad${k}`, 'vcc', `c${k}`, '1k')
      .resistor(`emitterSet${k}`, `e${k}`, GROUND, '2.2k')
      .capacitor(`rolloff${k}`, `c${k}`, GROUND, '100p');
  }
  return { circuit: c, output: `c${count}` };
}

function diodeMesh(side: number): { circuit: Circuit; output: string } {
  const c = new Circuit().voltageSource('supply', 'top', GROUND, { dc: 10, ac: '1m' });
  for (let i = 0; i < side; i++) {
    for (let j = 0; j < side; j++) {
      const node = `n${i}_${j}`;
      c.resistor(`leak${i}_${j}`, node, GROUND, '10k');
      if (i === 0) c.resistor(`feed${j}`, 'top', node, '1k');
      if (j + 1 < side) c.resistor(`across${i}_${j}`, node, `n${i}_${j + 1}`, '470');
      if (i + 1 < side) c.diode(`down${i}_${j}`, node, `n${i + 1}_${j}`, { junctionCapacitance: '2p' });
    }
  }
  return { circuit: c, output: `n${side - 1}_${side - 1}` };
}

function cmosChain(count: number): { circuit: Circuit; output: string } {
  const nmos = {
    polarity: 'nmos',
    thresholdVoltage: 0.6,
    gainFactor: '400µ',
    channelLengthModulation: 0.05,
    gateSourceCapacitance: '5f',
    gateDrainCapacitance: '1f',
  } as const;
  const pmos = {
    polarity: 'pmos',
    thresholdVoltage: -0.6,
    gainFactor: '400µ',
    channelLengthModulation: 0.05,
    gateSourceCapacitance: '5f',
    gateDrainCapacitance: '1f',
  } as const;
  const c = new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 3.3 })
    .voltageSource('tone', 'o0', GROUND, { dc: 1.65, ac: '1m' });
  for (let k = 1; k <= count; k++) {
    c.resistor(`input${k}`, `o${k - 1}`, `g${k}`, '100k')
      .mosfet(`pull${k}`, { drain: `o${k}`, gate: `g${k}`, source: 'vdd' }, pmos)
      .mosfet(`sink${k}`, { drain: `o${k}`, gate: `g${k}`, source: GROUND }, nmos)
      .resistor(`feedback${k}`, `o${k}`, `g${k}`, '100k')
      .capacitor(`load${k}`, `o${k}`, GROUND, '1p');
  }
  return { circuit: c, output: `o${count}` };
}
