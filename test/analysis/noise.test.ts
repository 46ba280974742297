/**
 * The noise analysis against the closed forms of the physics it models: thermal noise of resistors,
 * kT/C, shot noise, the bipolar and MOS generators, flicker noise, an op-amp's input noise through its
 * noise gain, and the noise figure. Each check names its source; the definitions are docs/noise.md's.
 */
import { describe, expect, it } from 'vitest';
import {
  BOLTZMANN,
  Circuit,
  ELEMENTARY_CHARGE,
  GROUND,
  logSweep,
  type Noise,
  noise,
  operatingPoint,
} from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

const parallel = (...r: number[]) => 1 / r.reduce((sum, x) => sum + 1 / x, 0);
const fourKT = (T: number) => 4 * BOLTZMANN * T;
const TIGHT = { relativeTolerance: 1e-12, voltageTolerance: 1e-15, currentTolerance: 1e-18 } as const;

/** The output density of one named contribution at frequency index k. */
function share(nz: Noise, element: string, mechanism: string, terminal?: string, k = 0): number {
  const c = nz.contributions.find(
    (entry) => entry.element === element && entry.mechanism === mechanism && entry.terminal === terminal,
  );
  if (c === undefined) throw new Error(`no ${mechanism} contribution of ${element}`);
  return c.density[k]!;
}

describe('noise of resistors', () => {
  // J. B. Johnson, "Thermal agitation of electricity in conductors", Phys. Rev. 32, 97 (1928);
  // H. Nyquist, "Thermal agitation of electric charge in conductors", Phys. Rev. 32, 110 (1928):
  // a resistance R at temperature T has an open-circuit noise PSD of 4kTR, so a divider's output
  // (the source shorted) is 4kT·(R1 ∥ R2).
  it('gives a divider the thermal noise √(4kT·R1∥R2) of its two resistors in parallel', () => {
    const c = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 5, ac: 1 })
      .resistor('upper', 'in', 'out', '10k')
      .resistor('lower', 'out', GROUND, '4.7k');
    const op = operatingPoint(c);
    const nz = noise(op, { output: 'out', frequencies: [1, 1e3, 1e6] });
    const expected = Math.sqrt(fourKT(op.temperature) * parallel(10e3, 4.7e3));
    for (const density of nz.outputDensity)
      expectRelativelyClose(density, expected, 1e-12, 'divider density');
    // Each resistor's share: its noise current 4kT/R through R1 ∥ R2.
    expectRelativelyClose(
      share(nz, 'upper', 'thermal'),
      Math.sqrt(fourKT(op.temperature) / 10e3) * parallel(10e3, 4.7e3),
      1e-12,
      'upper',
    );
    expect(nz.contributions.map((c) => c.element)).toEqual(['lower', 'upper']); // the larger power first
  });

  it('follows the temperature of the operating point', () => {
    const c = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 1 })
      .resistor('load', 'in', 'out', '1k')
      .resistor('shunt', 'out', GROUND, '1k');
    const cold = noise(operatingPoint(c, { temperature: 77 }), { output: 'out', frequencies: [1e3] });
    expectRelativelyClose(cold.outputDensity[0]!, Math.sqrt(fourKT(77) * 500), 1e-12, '77 K');
  });

  it('leaves out a resistor built noiseless', () => {
    const c = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 5 })
      .resistor('upper', 'in', 'out', '10k', { noiseless: true })
      .resistor('lower', 'out', GROUND, '10k');
    const op = operatingPoint(c);
    const nz = noise(op, { output: 'out', frequencies: [1e3] });
    expect(nz.contributions.map((e) => e.element)).toEqual(['lower']);
    expectRelativelyClose(
      nz.outputDensity[0]!,
      Math.sqrt(fourKT(op.temperature) / 10e3) * 5e3,
      1e-12,
      'one resistor',
    );
  });

  // The current through a resistor carries its own noise current besides the response to it: in a
  // loop of R1 and R2 (the source shorted) the current noise is that of R1 + R2, √(4kT/(R1 + R2)).
  it('reads an element current with the element’s own noise in it', () => {
    const c = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 1 })
      .resistor('upper', 'in', 'out', '1k')
      .resistor('lower', 'out', GROUND, '3k');
    const op = operatingPoint(c);
    const nz = noise(op, { output: { element: 'lower' }, frequencies: [1e3] });
    expectRelativelyClose(
      nz.outputDensity[0]!,
      Math.sqrt(fourKT(op.temperature) / 4e3),
      1e-12,
      'loop current',
    );
  });
});

describe('integrated noise of an RC low-pass', () => {
  // The PSD 4kTR/(1 + (f/fc)²), fc = 1/(2πRC), integrates to kT/C over all frequencies, whatever R
  // (a classic result: e.g. P. R. Gray, P. J. Hurst, S. H. Lewis and R. G. Meyer, Analysis and
  // Design of Analog Integrated Circuits, 5th ed., 2009, §11.2), and over [a, b] to
  // 4kTR·fc·(atan(b/fc) − atan(a/fc)).
  const R = 10e3;
  const C = 1e-9;
  const fc = 1 / (2 * Math.PI * R * C);
  const c = new Circuit()
    .voltageSource('supply', 'in', GROUND, { dc: 0 })
    .resistor('filter', 'in', 'out', R)
    .capacitor('hold', 'out', GROUND, C);
  const op = operatingPoint(c);
  const kT = BOLTZMANN * op.temperature;
  const nz = noise(op, { output: 'out', frequencies: logSweep(fc * 1e-4, fc * 1e5, 40) });

  // Between points 1/40 decade apart the log-log line misses the curved knee by about 1e-4.
  it('tends to √(kT/C) over a wide band', () => {
    expectRelativelyClose(nz.integrated(fc * 1e-4, fc * 1e5), Math.sqrt(kT / C), 3e-4, 'kT/C');
  });

  it('matches the exact integral over a finite band', () => {
    for (const [a, b] of [
      [fc / 10, fc * 3],
      [fc * 0.5, fc * 2.05],
      [fc * 1e-4, fc * 1e5],
    ] as const) {
      const exact = 4 * kT * R * fc * (Math.atan(b / fc) - Math.atan(a / fc));
      expectRelativelyClose(nz.integrated(a, b), Math.sqrt(exact), 3e-4, `band [${a}, ${b}]`);
    }
  });

  it('refuses a band outside the analysed frequencies or an empty one', () => {
    expectQuiescentError(() => nz.integrated(fc * 1e-5, fc), 'invalid-value', 'low');
    expectQuiescentError(() => nz.integrated(fc, fc * 1e6), 'invalid-value', 'high');
    expectQuiescentError(() => nz.integrated(fc, fc), 'invalid-value', 'high');
  });
});

describe('shot noise of a diode', () => {
  // W. Schottky, "Über spontane Stromschwankungen in verschiedenen Elektrizitätsleitern", Ann. Phys.
  // 57, 541 (1918): a current I of independent carriers crossing a barrier has the PSD 2qI. The
  // diode's noise current sees its own dynamic resistance r_d in parallel with the feed resistor.
  it('is 2q·(I + 2Is) through r_d ∥ R, beside the resistor’s thermal noise', () => {
    const R = 10e3;
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
      .resistor('feed', 'vcc', 'a', R)
      .diode('sensor', 'a', GROUND, { saturationCurrent: 1e-14 });
    const op = operatingPoint(c, TIGHT);
    const d = op.diode('sensor');
    const nz = noise(op, { output: 'a', frequencies: [1e3] });
    const is = 1e-14 * 1; // at the reference temperature, I_S(T) = I_S
    const exponential = d.current - 1e-12 * d.junctionVoltage; // the junction conductance's share taken out
    const z = parallel(R, d.resistance);
    const shot = Math.sqrt(2 * ELEMENTARY_CHARGE * (exponential + 2 * is)) * z;
    const thermal = Math.sqrt(fourKT(op.temperature) / R) * z;
    expectRelativelyClose(share(nz, 'sensor', 'shot'), shot, 1e-9, 'shot');
    expectRelativelyClose(nz.outputDensity[0]!, Math.hypot(shot, thermal), 1e-9, 'total');
  });

  it('adds the series resistance’s thermal noise', () => {
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
      .resistor('feed', 'vcc', 'a', '10k', { noiseless: true })
      .diode('sensor', 'a', GROUND, { seriesResistance: 50 });
    const op = operatingPoint(c, TIGHT);
    const d = op.diode('sensor');
    const nz = noise(op, { output: 'a', frequencies: [1e3] });
    // The series noise current 4kT/R_S across R_S sees R_S ∥ (r_d + R), divided down to the anode.
    const rs = 50;
    const rd = d.resistance;
    const across = Math.sqrt(fourKT(op.temperature) / rs) * parallel(rs, rd + 10e3);
    const atAnode = (across * 10e3) / (10e3 + rd);
    expectRelativelyClose(share(nz, 'sensor', 'thermal'), atAnode, 1e-9, 'series resistance');
  });
});

describe('flicker noise', () => {
  // The empirical 1/f law K_f·|I|^a_f/f (A. van der Ziel, Noise in Solid State Devices and Circuits,
  // 1986), with the coefficient and exponent as given.
  it('has the PSD K_f·I^a_f/f through the diode’s impedance', () => {
    const K = 1e-16;
    const a = 1.3;
    const R = 4.7e3;
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
      .resistor('feed', 'vcc', 'a', R)
      .diode('marker', 'a', GROUND, { flickerCoefficient: K, flickerExponent: a });
    const op = operatingPoint(c, TIGHT);
    const d = op.diode('marker');
    const nz = noise(op, { output: 'a', frequencies: [1, 100] });
    for (const [k, f] of [1, 100].entries()) {
      const expected = Math.sqrt((K * d.current ** a) / f) * parallel(R, d.resistance);
      expectRelativelyClose(
        share(nz, 'marker', 'flicker', undefined, k),
        expected,
        1e-9,
        `flicker at ${f} Hz`,
      );
    }
  });

  it('has the PSD K_f·|id|^a_f/f between drain and source of a MOSFET', () => {
    const K = 2e-14;
    const RD = 10e3;
    const c = new Circuit()
      .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
      .voltageSource('bias', 'g', GROUND, { dc: 1.2 })
      .resistor('load', 'vdd', 'd', RD, { noiseless: true })
      .mosfet(
        'amplifier',
        { drain: 'd', gate: 'g', source: GROUND },
        { polarity: 'nmos', flickerCoefficient: K, flickerExponent: 2 },
      );
    const op = operatingPoint(c, TIGHT);
    const m = op.mosfet('amplifier');
    const nz = noise(op, { output: 'd', frequencies: [10] });
    const channel = m.id - 1e-12 * m.vds; // the channel's own current, without the junction conductance's
    const expected = Math.sqrt((K * channel ** 2) / 10) * parallel(RD, 1 / (m.gds + 1e-12));
    expectRelativelyClose(share(nz, 'amplifier', 'flicker'), expected, 1e-9, 'MOSFET flicker');
  });
});

describe('a common-emitter stage', () => {
  // P. R. Gray, P. J. Hurst, S. H. Lewis and R. G. Meyer, Analysis and Design of Analog Integrated
  // Circuits, 5th ed., Wiley 2009, §11.4 (bipolar transistor noise): collector shot noise 2qI_C,
  // base shot noise 2qI_B; referred to the input source through the gain g_m·R_C·r_π/(R_S + r_π),
  // the collector's becomes (2qI_C/g_m²)·((R_S + r_π)/r_π)² and the base's 2qI_B·R_S².
  const sourceResistance = 2e3;
  const RC = 4.7e3;
  const c = new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .voltageSource('signal', 'src', GROUND, { dc: 0.66, ac: 1 })
    .resistor('source', 'src', 'b', sourceResistance, { noiseless: true })
    .resistor('load', 'vcc', 'c', RC, { noiseless: true })
    .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, { polarity: 'npn', forwardBeta: 150 });
  const op = operatingPoint(c, TIGHT);
  const q = op.bjt('Q1');
  const q2 = 2 * ELEMENTARY_CHARGE;
  const nz = noise(op, { output: 'c', frequencies: [1e3], input: 'signal' });

  it('puts the collector and base shot noise at the output', () => {
    expect(q.region).toBe('forward-active');
    const collector = Math.sqrt(q2 * q.ic) * RC;
    const base = Math.sqrt(q2 * q.ib) * parallel(sourceResistance, q.rpi) * q.gm * RC;
    expectRelativelyClose(share(nz, 'Q1', 'shot', 'collector'), collector, 1e-6, 'collector shot');
    expectRelativelyClose(share(nz, 'Q1', 'shot', 'base'), base, 1e-6, 'base shot');
    expectRelativelyClose(nz.outputDensity[0]!, Math.hypot(collector, base), 1e-6, 'total');
  });

  it('refers it to the input as 2qI_B·R_S² + (2qI_C/g_m²)·((R_S + r_π)/r_π)²', () => {
    const referred =
      q2 * q.ib * sourceResistance ** 2 +
      ((q2 * q.ic) / q.gm ** 2) * ((sourceResistance + q.rpi) / q.rpi) ** 2;
    expectRelativelyClose(nz.inputDensity![0]!, Math.sqrt(referred), 1e-6, 'input-referred');
  });
});

describe('MOSFET channel noise', () => {
  // Y. Tsividis, Operation and Modeling of the MOS Transistor, 2nd ed., Oxford 1999, chapter on
  // noise: the long-channel thermal noise is 4kT·(2/3)·g_m in saturation and 4kT·g_d0 (the channel
  // conductance at v_DS = 0) in the linear region's limit.
  it('is 4kT·(2/3)·g_m in saturation', () => {
    const RD = 5e3;
    const c = new Circuit()
      .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
      .voltageSource('bias', 'g', GROUND, { dc: 1.5 })
      .resistor('load', 'vdd', 'd', RD, { noiseless: true })
      .mosfet('amplifier', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos', gainFactor: 2e-3 });
    const op = operatingPoint(c, TIGHT);
    const m = op.mosfet('amplifier');
    expect(m.region).toBe('saturation');
    const nz = noise(op, { output: 'd', frequencies: [1e3] });
    const expected = Math.sqrt(fourKT(op.temperature) * (2 / 3) * m.gm) * parallel(RD, 1 / (m.gds + 1e-12));
    expectRelativelyClose(nz.outputDensity[0]!, expected, 1e-9, 'saturation');
  });

  it('is the thermal noise 4kT·g_ds of the channel conductance at v_DS = 0', () => {
    const R = 1e3;
    const c = new Circuit()
      .voltageSource('bias', 'g', GROUND, { dc: 3 })
      .resistor('load', 'd', GROUND, R, { noiseless: true })
      .mosfet('switch', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos' });
    const op = operatingPoint(c, TIGHT);
    const m = op.mosfet('switch');
    expect(Math.abs(m.vds)).toBeLessThan(1e-12);
    const nz = noise(op, { output: 'd', frequencies: [1e3] });
    const gds = m.gds; // β·V_ov at v_DS = 0
    expectRelativelyClose(gds, 1e-3 * (3 - 0.7), 1e-9, 'channel conductance');
    const expected = Math.sqrt(fourKT(op.temperature) * gds) * parallel(R, 1 / (gds + 1e-12));
    expectRelativelyClose(nz.outputDensity[0]!, expected, 1e-9, 'v_DS = 0');
  });
});

describe('an op-amp in a non-inverting amplifier', () => {
  // The noise-gain formula of an op-amp stage (W. Jung, ed., Op Amp Applications Handbook, Analog
  // Devices / Newnes 2005, §1.7 "Op amp noise"): with noise gain G = 1 + R_F/R_G,
  // e_out² = G²·(e_n² + i_n²·R_S² + 4kT·R_S) + i_n²·R_F² + 4kT·R_F + 4kT·R_G·(R_F/R_G)².
  const sourceResistance = 1e3;
  const RF = 99e3;
  const RG = 1e3;
  const en = 8e-9;
  const inoise = 2e-12;
  const build = (finite: boolean) =>
    new Circuit()
      .voltageSource('microphone', 'src', GROUND, { dc: 0, ac: 1 })
      .resistor('source', 'src', 'p', sourceResistance)
      .resistor('feedback', 'out', 'n', RF)
      .resistor('ground leg', 'n', GROUND, RG)
      .opAmp(
        'U1',
        { plus: 'p', minus: 'n', output: 'out' },
        {
          inputNoiseVoltage: en,
          inputNoiseCurrent: inoise,
          voltageNoiseCorner: 100,
          currentNoiseCorner: 1e3,
          ...(finite ? { openLoopGain: 1e7 } : {}),
        },
      );
  const expected = (T: number, f: number) => {
    const G = 1 + RF / RG;
    const e2 = en * en * (1 + 100 / f);
    const i2 = inoise * inoise * (1 + 1e3 / f);
    return Math.sqrt(
      G * G * (e2 + i2 * sourceResistance * sourceResistance + fourKT(T) * sourceResistance) +
        i2 * RF * RF +
        fourKT(T) * RF +
        fourKT(T) * RG * (RF / RG) ** 2,
    );
  };

  it('matches the noise-gain formula, corners included, for the ideal model', () => {
    const op = operatingPoint(build(false));
    const nz = noise(op, { output: 'out', frequencies: [10, 1e3, 1e5], input: 'microphone' });
    for (const [k, f] of [10, 1e3, 1e5].entries()) {
      expectRelativelyClose(nz.outputDensity[k]!, expected(op.temperature, f), 1e-12, `output at ${f} Hz`);
      expectRelativelyClose(
        nz.inputDensity![k]!,
        expected(op.temperature, f) / 100,
        1e-12,
        `input at ${f} Hz`,
      );
    }
    expect(share(nz, 'U1', 'input-voltage')).toBeGreaterThan(share(nz, 'U1', 'input-current', 'plus'));
  });

  it('approaches it with a large finite gain', () => {
    const op = operatingPoint(build(true));
    const nz = noise(op, { output: 'out', frequencies: [1e3] });
    expectRelativelyClose(nz.outputDensity[0]!, expected(op.temperature, 1e3), 1e-4, 'finite gain 1e7');
  });
});

describe('the noise figure', () => {
  // H. T. Friis, "Noise figures of radio receivers", Proc. IRE 32, 419 (1944): F = total output noise
  // over the output noise due to the source alone. An amplifier whose only noise is an input
  // resistor equal to the source resistance doubles the noise: 10·log10 2 = 3.0103 dB.
  const build = (noiseless: boolean) =>
    new Circuit()
      .voltageSource('antenna', 'src', GROUND, { dc: 0, ac: 1 })
      .resistor('source', 'src', 'in', '50')
      .resistor('termination', 'in', GROUND, '50', { noiseless })
      .vcvs('amplifier', ['out', GROUND], ['in', GROUND], 10);
  it('is 3.01 dB when the only other noise is a resistor equal to the source resistor', () => {
    const nz = noise(operatingPoint(build(false)), {
      output: 'out',
      frequencies: [1e6, 1e8],
      sourceResistor: 'source',
    });
    for (const value of nz.noiseFigure!) expectRelativelyClose(value, 10 * Math.log10(2), 1e-12, 'NF');
    expect(nz.noiseFigure![0]!.toFixed(2)).toBe('3.01');
  });
  it('is 0 dB for a noiseless amplifier', () => {
    const nz = noise(operatingPoint(build(true)), {
      output: 'out',
      frequencies: [1e6],
      sourceResistor: 'source',
    });
    expect(Math.abs(nz.noiseFigure![0]!)).toBeLessThan(1e-12);
  });
});

describe('noise on bad requests', () => {
  const c = new Circuit()
    .voltageSource('supply', 'in', GROUND, { dc: 1, ac: 1 })
    .resistor('upper', 'in', 'out', '1k')
    .resistor('lower', 'out', GROUND, '1k', { noiseless: true })
    .capacitor('block', 'out', 'far', '1u')
    .resistor('far load', 'far', GROUND, '1k');
  const op = operatingPoint(c);
  it('refuses a frequency of 0 Hz or a missing list', () => {
    expectQuiescentError(
      () => noise(op, { output: 'out', frequencies: [0, 1] }),
      'invalid-value',
      'frequencies',
    );
    expectQuiescentError(() => noise(op, { output: 'out', frequencies: [] }), 'invalid-value', 'frequencies');
    expectQuiescentError(() => noise(op, null as never), 'invalid-value', 'options');
  });
  it('names an output, input or source resistor the circuit lacks or cannot use', () => {
    expectQuiescentError(() => noise(op, { output: 'nowhere', frequencies: [1] }), 'unknown-node', 'nowhere');
    expectQuiescentError(
      () => noise(op, { output: 'out', frequencies: [1], input: 'upper' }),
      'unknown-element',
      'upper',
    );
    expectQuiescentError(
      () => noise(op, { output: 'out', frequencies: [1], input: 'ghost' }),
      'unknown-element',
      'ghost',
    );
    expectQuiescentError(
      () => noise(op, { output: 'out', frequencies: [1], sourceResistor: 'supply' }),
      'unknown-element',
      'supply',
    );
    expectQuiescentError(
      () => noise(op, { output: 'out', frequencies: [1], sourceResistor: 'lower' }),
      'invalid-value',
      'noiseless',
    );
  });
  it('refuses an input whose signal does not reach the output', () => {
    const blocked = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 1, ac: 1 })
      .resistor('upper', 'in', 'out', '1k')
      .voltageSource('clamp', 'out', GROUND, { dc: 0 })
      .resistor('far', 'out', 'x', '1k')
      .resistor('far load', 'x', GROUND, '1k');
    const nz = () => noise(operatingPoint(blocked), { output: 'x', frequencies: [1], input: 'supply' });
    expectQuiescentError(nz, 'invalid-value', 'supply');
  });
});
