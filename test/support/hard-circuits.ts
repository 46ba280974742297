/**
 * A set of circuits that are hard for an operating-point search, each of our own invention: chains
 * and rings of CMOS inverters, latches, Schmitt triggers, references with a start-up problem,
 * mirrors, push-pull stages, a long diode string across a kilovolt, extreme temperatures and
 * parameters. Each either has a solution (`expect: 'solves'`) or must fail with a named code. Shared
 * by test/analysis/convergence.test.ts (the quick ones) and bench/convergence.ts (all of them).
 */
import { Circuit, type ErrorCode, GROUND } from '../../src/index.js';

/** One hard circuit and what the search must make of it. */
export interface HardCircuit {
  readonly name: string;
  readonly build: () => Circuit;
  /** `'solves'`, or the code of the failure that the circuit truly has. */
  readonly expect: 'solves' | ErrorCode;
  /** Too slow for the test run (seconds): benchmarked only. */
  readonly slow?: boolean;
  /** Operating-point options, when the circuit needs them (an extreme temperature). */
  readonly temperature?: number;
}

const NMOS = { polarity: 'nmos' } as const;
const PMOS = { polarity: 'pmos' } as const;
const NPN = { polarity: 'npn', forwardBeta: 100, earlyVoltage: 80 } as const;
const PNP = { polarity: 'pnp', forwardBeta: 60, earlyVoltage: 50 } as const;

/** Add a CMOS inverter from `input` to `output` on supply node `vdd`. */
function inverter(
  c: Circuit,
  name: string,
  input: string,
  output: string,
  lambda: number,
  vdd = 'vdd',
): Circuit {
  return c
    .mosfet(
      `${name}up`,
      { drain: output, gate: input, source: vdd },
      { ...PMOS, channelLengthModulation: lambda },
    )
    .mosfet(
      `${name}down`,
      { drain: output, gate: input, source: GROUND },
      { ...NMOS, channelLengthModulation: lambda },
    );
}

/** A chain of `stages` inverters on a 5 V supply, driven at `input` volts; outputs s1 … s<stages>. */
export function inverterChain(stages: number, lambda: number, input: number): Circuit {
  const c = new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
    .voltageSource('drive', 's0', GROUND, { dc: input });
  for (let k = 0; k < stages; k++) inverter(c, `stage${k}`, `s${k}`, `s${k + 1}`, lambda);
  return c;
}

/** A ring of an odd number of inverters: its only DC solution is every node at the switching point. */
export function inverterRing(stages: number, lambda: number): Circuit {
  const c = new Circuit().voltageSource('supply', 'vdd', GROUND, { dc: 5 });
  for (let k = 0; k < stages; k++) inverter(c, `stage${k}`, `r${k}`, `r${(k + 1) % stages}`, lambda);
  return c;
}

/** Two cross-coupled inverters (a storage cell), nudged by a weak pull on one side. */
function storageCell(pull: number): Circuit {
  const c = new Circuit().voltageSource('supply', 'vdd', GROUND, { dc: 3.3 });
  inverter(c, 'left', 'q', 'qbar', 0.02, 'vdd');
  inverter(c, 'right', 'qbar', 'q', 0.02, 'vdd');
  return c.resistor('nudge', 'q', pull > 0 ? 'vdd' : GROUND, '1M');
}

/** A Schmitt trigger: an op-amp with resistive positive feedback, and two clamp diodes at its output. */
function schmittTrigger(input: number): Circuit {
  return new Circuit()
    .voltageSource('drive', 'in', GROUND, { dc: input })
    .resistor('feedIn', 'in', 'minus', '10k')
    .resistor('threshold', 'plus', GROUND, '10k')
    .resistor('hysteresis', 'plus', 'limited', '100k')
    .opAmp(
      'comparator',
      { plus: 'plus', minus: 'minus', output: 'raw' },
      { openLoopGain: 1e5, outputResistance: 100 },
    )
    .resistor('clampFeed', 'raw', 'limited', '1k')
    .diode('clampHigh', 'limited', 'railHigh')
    .diode('clampLow', 'railLow', 'limited')
    .voltageSource('highRail', 'railHigh', GROUND, { dc: 4.3 })
    .voltageSource('lowRail', 'railLow', GROUND, { dc: -4.3 })
    .resistor('load', 'limited', GROUND, '10k');
}

/** A BJT Schmitt trigger (two emitter-coupled transistors, collector of the first driving the second). */
function emitterCoupledSchmitt(input: number): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
    .voltageSource('drive', 'in', GROUND, { dc: input })
    .resistor('firstLoad', 'vcc', 'c1', '2.2k')
    .resistor('secondLoad', 'vcc', 'out', '1k')
    .resistor('couple', 'c1', 'b2', '4.7k')
    .resistor('secondBias', 'b2', GROUND, '10k')
    .resistor('sharedEmitter', 'e', GROUND, '470')
    .bjt('first', { collector: 'c1', base: 'in', emitter: 'e' }, NPN)
    .bjt('second', { collector: 'out', base: 'b2', emitter: 'e' }, NPN);
}

/** A self-biased current reference (two mirrors in a loop): zero current is also a solution. */
function selfBiasedReference(withStartup: boolean): Circuit {
  const c = new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
    .mosfet('topLeft', { drain: 'a', gate: 'b', source: 'vdd' }, { ...PMOS, gainFactor: 1e-4 })
    .mosfet('topRight', { drain: 'b', gate: 'b', source: 'vdd' }, { ...PMOS, gainFactor: 1e-4 })
    .mosfet('bottomLeft', { drain: 'a', gate: 'a', source: GROUND }, { ...NMOS, gainFactor: 1e-4 })
    .mosfet('bottomRight', { drain: 'b', gate: 'a', source: 'degenerate' }, { ...NMOS, gainFactor: 4e-4 })
    .resistor('degeneration', 'degenerate', GROUND, '10k');
  // The start-up resistor leaks a little current into the loop so that zero current is not a solution.
  return withStartup ? c.resistor('startup', 'vdd', 'a', '10M') : c;
}

/** A bandgap-style core: two diode-connected transistors at 1:8 area ratio (saturation current). */
function bandgapCore(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
    .resistor('leftFeed', 'vcc', 'left', '20k')
    .resistor('rightFeed', 'vcc', 'right', '20k')
    .bjt('unit', { collector: 'left', base: 'left', emitter: GROUND }, NPN)
    .bjt('wide', { collector: 'right', base: 'right', emitter: 'ptat' }, { ...NPN, saturationCurrent: 8e-16 })
    .resistor('ptatResistor', 'ptat', GROUND, '1k');
}

/** A Widlar current mirror feeding a load from a 12 V supply. */
function widlarMirror(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .resistor('reference', 'vcc', 'ref', '10k')
    .bjt('master', { collector: 'ref', base: 'ref', emitter: GROUND }, NPN)
    .bjt('slave', { collector: 'out', base: 'ref', emitter: 'degenerate' }, NPN)
    .resistor('degeneration', 'degenerate', GROUND, '5k')
    .resistor('load', 'vcc', 'out', '100k');
}

/** A cascode MOSFET mirror. */
function cascodeMirror(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
    .currentSource('bias', 'vdd', 'g2', { dc: 100e-6 })
    .mosfet('refTop', { drain: 'g2', gate: 'g2', source: 'g1' }, NMOS)
    .mosfet('refBottom', { drain: 'g1', gate: 'g1', source: GROUND }, NMOS)
    .mosfet('outTop', { drain: 'out', gate: 'g2', source: 'mid' }, NMOS)
    .mosfet('outBottom', { drain: 'mid', gate: 'g1', source: GROUND }, NMOS)
    .resistor('load', 'vdd', 'out', '10k');
}

/** A complementary emitter-follower output stage biased by two diodes, driving 8 Ω. */
function pushPull(input: number): Circuit {
  return new Circuit()
    .voltageSource('positive', 'vcc', GROUND, { dc: 15 })
    .voltageSource('negative', 'vee', GROUND, { dc: -15 })
    .voltageSource('drive', 'in', GROUND, { dc: input })
    .resistor('upperBias', 'vcc', 'bn', '2.2k')
    .diode('upperDrop', 'bn', 'in')
    .diode('lowerDrop', 'in', 'bp')
    .resistor('lowerBias', 'bp', 'vee', '2.2k')
    .bjt('pushing', { collector: 'vcc', base: 'bn', emitter: 'en' }, NPN)
    .bjt('pulling', { collector: 'vee', base: 'bp', emitter: 'ep' }, PNP)
    .resistor('upperEmitter', 'en', 'out', '0.5')
    .resistor('lowerEmitter', 'ep', 'out', '0.5')
    .resistor('speaker', 'out', GROUND, '8');
}

/** n diodes in series across `volts` through a resistor. */
export function diodeString(count: number, volts: number, resistance: number): Circuit {
  const c = new Circuit()
    .voltageSource('supply', 'd0', GROUND, { dc: volts })
    .resistor('limit', 'd0', 'd1', resistance);
  for (let k = 1; k <= count; k++) c.diode(`drop${k}`, `d${k}`, k === count ? GROUND : `d${k + 1}`);
  return c;
}

/** A BJT ring oscillator core biased off: three inverting common-emitter stages in a ring. */
function bjtRing(): Circuit {
  const c = new Circuit().voltageSource('supply', 'vcc', GROUND, { dc: 5 });
  for (let k = 0; k < 3; k++) {
    c.resistor(`load${k}`, 'vcc', `c${k}`, '1k')
      .resistor(`couple${k}`, `c${k}`, `b${(k + 1) % 3}`, '10k')
      .bjt(`stage${k}`, { collector: `c${k}`, base: `b${k}`, emitter: GROUND }, NPN);
  }
  return c;
}

/** A diode bridge feeding a filter capacitor and a zener-like string of forward diodes. */
function rectifierClamp(): Circuit {
  const c = new Circuit()
    .voltageSource('mains', 'l', 'n', { dc: 325 })
    .resistor('neutralReturn', 'n', GROUND, '1')
    .diode('bridge1', 'l', 'plus')
    .diode('bridge2', 'n', 'plus')
    .diode('bridge3', 'minus', 'l')
    .diode('bridge4', 'minus', 'n')
    .capacitor('reservoir', 'plus', 'minus', '100u')
    .resistor('dropper', 'plus', 'c0', '100k');
  for (let k = 0; k < 10; k++) c.diode(`clamp${k}`, `c${k}`, k === 9 ? 'minus' : `c${k + 1}`);
  return c.resistor('bleed', 'c0', 'minus', '1M');
}

/** An op-amp follower whose input is a 1e-15 Ω link: solved only with iterative refinement. */
function tinyLinkFollower(): Circuit {
  return new Circuit()
    .voltageSource('reference', 'in', GROUND, { dc: 1.25 })
    .resistor('link', 'in', 'x', 1e-15)
    .opAmp('buffer', { plus: 'x', minus: 'out', output: 'out' })
    .resistor('load', 'out', GROUND, '1k');
}

/** A vcvs whose output is its own control, with unit gain: 0 = 0 in its branch equation. */
function selfDrivenSource(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'in', GROUND, { dc: 1 })
    .resistor('feed', 'in', 'a', '1k')
    .vcvs('follower', ['a', GROUND], ['a', GROUND], 1);
}

/** Fifteen gain-of-ten stages closed by 1 Ω back to a driven node: 300 dB, beyond double precision. */
function highGainChain(): Circuit {
  const c = new Circuit().voltageSource('supply', 's0', GROUND, { dc: 1e-3 });
  for (let k = 0; k < 15; k++)
    c.vcvs(`stage${k}`, [`s${k + 1}`, GROUND], [`s${k}`, GROUND], 10).resistor(
      `load${k}`,
      `s${k + 1}`,
      GROUND,
      '1k',
    );
  return c.resistor('back', 's15', 's0', 1);
}

/** The hard set: at least thirty circuits. */
export const HARD_CIRCUITS: readonly HardCircuit[] = [
  { name: 'three inverters at 2.40 V', build: () => inverterChain(3, 0, 2.4), expect: 'solves' },
  { name: 'three inverters at 2.45 V', build: () => inverterChain(3, 0, 2.45), expect: 'solves' },
  {
    name: 'three inverters at 2.50 V (the switching point)',
    build: () => inverterChain(3, 0, 2.5),
    expect: 'solves',
  },
  { name: 'ten inverters, λ = 0.05, at 0 V', build: () => inverterChain(10, 0.05, 0), expect: 'solves' },
  { name: '50 inverters, λ = 0, at 5 V', build: () => inverterChain(50, 0, 5), expect: 'solves' },
  { name: '200 inverters, λ = 0.02, at 0 V', build: () => inverterChain(200, 0.02, 0), expect: 'solves' },
  {
    name: '500 inverters, λ = 0.05, at 0 V',
    build: () => inverterChain(500, 0.05, 0),
    expect: 'solves',
    slow: true,
  },
  {
    name: '1,000 inverters, λ = 0, at 0 V',
    build: () => inverterChain(1000, 0, 0),
    expect: 'solves',
    slow: true,
  },
  {
    name: '10,000 inverters, λ = 0, at 0 V',
    build: () => inverterChain(10000, 0, 0),
    expect: 'solves',
    slow: true,
  },
  { name: 'ring of three inverters', build: () => inverterRing(3, 0.02), expect: 'solves' },
  { name: 'ring of 11 inverters', build: () => inverterRing(11, 0.02), expect: 'solves' },
  { name: 'ring of 101 inverters', build: () => inverterRing(101, 0.05), expect: 'solves' },
  { name: 'storage cell nudged high', build: () => storageCell(1), expect: 'solves' },
  { name: 'storage cell nudged low', build: () => storageCell(-1), expect: 'solves' },
  { name: 'op-amp Schmitt trigger below its threshold', build: () => schmittTrigger(-1), expect: 'solves' },
  { name: 'op-amp Schmitt trigger above its threshold', build: () => schmittTrigger(1), expect: 'solves' },
  { name: 'emitter-coupled Schmitt trigger at 1 V', build: () => emitterCoupledSchmitt(1), expect: 'solves' },
  {
    name: 'emitter-coupled Schmitt trigger at 2.5 V',
    build: () => emitterCoupledSchmitt(2.5),
    expect: 'solves',
  },
  {
    name: 'self-biased reference without start-up',
    build: () => selfBiasedReference(false),
    expect: 'solves',
  },
  { name: 'self-biased reference with start-up', build: () => selfBiasedReference(true), expect: 'solves' },
  { name: 'bandgap core at 1:8', build: bandgapCore, expect: 'solves' },
  { name: 'Widlar mirror', build: widlarMirror, expect: 'solves' },
  { name: 'cascode mirror', build: cascodeMirror, expect: 'solves' },
  { name: 'push-pull stage at 0 V', build: () => pushPull(0), expect: 'solves' },
  { name: 'push-pull stage at 10 V', build: () => pushPull(10), expect: 'solves' },
  { name: '100 diodes in series across 1 kV', build: () => diodeString(100, 1000, 1e3), expect: 'solves' },
  { name: '100 diodes across 1 kV through 1 Ω', build: () => diodeString(100, 1000, 1), expect: 'solves' },
  { name: 'BJT ring of three stages', build: bjtRing, expect: 'solves' },
  { name: 'rectifier and diode clamp at mains peak', build: rectifierClamp, expect: 'solves' },
  {
    name: 'diode string at 220 K',
    build: () => diodeString(20, 30, 1e3),
    expect: 'solves',
    temperature: 220,
  },
  {
    name: 'diode string at 450 K',
    build: () => diodeString(20, 30, 1e3),
    expect: 'solves',
    temperature: 450,
  },
  {
    name: 'inverter chain at 400 K',
    build: () => inverterChain(20, 0.02, 0),
    expect: 'solves',
    temperature: 400,
  },
  { name: 'follower behind a 1e-15 Ω link', build: tinyLinkFollower, expect: 'solves' },
  { name: 'vcvs driving its own control node', build: selfDrivenSource, expect: 'singular' },
  { name: '300 dB gain chain closed by 1 Ω', build: highGainChain, expect: 'singular' },
];
