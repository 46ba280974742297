import { describe, expect, it } from 'vitest';
import {
  type BjtModel,
  Circuit,
  GROUND,
  type OperatingPointOptions,
  operatingPoint,
  thermalVoltage,
} from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';

const VT = thermalVoltage(298.15);

/** A transistor with its base-emitter and collector-emitter voltages set by ideal sources. */
function biased(vbe: number, vce: number, model: BjtModel, options: OperatingPointOptions = {}) {
  const c = new Circuit()
    .voltageSource('baseBias', 'b', GROUND, { dc: vbe })
    .voltageSource('collectorBias', 'c', GROUND, { dc: vce })
    .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, model);
  return operatingPoint(c, options).bjt('Q1');
}

describe('the bipolar transistor in forward-active operation', () => {
  const model: BjtModel = { polarity: 'npn', forwardBeta: 120, earlyVoltage: 60 };
  const q = biased(0.65, 5, model);
  // Terminal currents include the default 1e-12 S across each junction: 1e-12 × 4.35 V of the 89 µA
  // collector current is 5e-8, hence 1e-7 below.

  it('has g_m = I_C/Vt', () => {
    // Hybrid-π model (Sedra & Smith, Microelectronic Circuits, from memory).
    expectRelativelyClose(q.gm, q.ic / VT, 1e-7, 'g_m');
  });

  it('has r_π = β/g_m', () => {
    // Hybrid-π model (Sedra & Smith, from memory); β here is βF, ic/ib without the Early factor.
    expectRelativelyClose(q.rpi, 120 / (q.ic / VT / (1 + 5 / 60)), 1e-7, 'r_π');
  });

  it('has r_o = (V_A + v_CE)/I_C, about V_A/I_C', () => {
    // Early effect in the hybrid-π model (Sedra & Smith, from memory).
    expectRelativelyClose(q.ro, (60 + 5) / q.ic, 1e-7, 'r_o');
    expectRelativelyClose(q.ro, 60 / q.ic, 5 / 60 + 1e-6, 'r_o ≈ V_A/I_C');
  });

  it('gives ie = ic + ib and ic = β·ib·(1 + vce/V_A)', () => {
    // Transport Ebers-Moll model of docs/devices.md, "Bipolar transistor", forward-active, reverse
    // terms negligible. The junction conductance is made negligible: 1e-12 S × 3.7 V would be 5e-6
    // of the 0.7 µA base current.
    const q = biased(0.65, 5, model, { junctionConductance: 1e-30 });
    expectRelativelyClose(q.ie, q.ic + q.ib, 1e-15, 'ie');
    // The reverse leakage I_S/βR = 1e-15 A is 1.5e-9 of the base current.
    expectRelativelyClose(q.ic / q.ib, 120 * (1 + 5 / 60), 1e-8, 'ic/ib');
    expect(q.region).toBe('forward-active');
    expect(q.ro).toBeGreaterThan(0);
  });

  it('has an r_o beyond 1e15 Ω without the Early effect (only the reverse junction slopes the output)', () => {
    // docs/devices.md, "Bipolar transistor": without earlyVoltage the factor (1 + vce/V_A) is 1.
    expect(biased(0.65, 5, { polarity: 'npn' }).ro).toBeGreaterThan(1e15);
  });
});

describe('the pnp transistor', () => {
  it('has ic and ib positive, vbe and vce negative, in forward-active operation', () => {
    // docs/building-circuits.md, "Sign conventions", and docs/devices.md, "Bipolar transistor": the pnp
    // obeys the npn law in the mirrored voltages.
    const model = { forwardBeta: 80, earlyVoltage: 40 };
    const c = new Circuit()
      .voltageSource('emitterBias', 'e', 'b', { dc: 0.66 })
      .voltageSource('baseBias', 'b', GROUND, { dc: 2 })
      .bjt('Q1', { collector: GROUND, base: 'b', emitter: 'e' }, { polarity: 'pnp', ...model });
    const p = operatingPoint(c).bjt('Q1');
    const n = biased(0.66, 2.66, { polarity: 'npn', ...model });
    expect(p.vbe).toBeCloseTo(-0.66, 12);
    expect(p.vce).toBeCloseTo(-2.66, 12);
    expect(p.ic).toBeGreaterThan(0);
    expect(p.ib).toBeGreaterThan(0);
    expect(p.region).toBe('forward-active');
    // Mirror symmetry: the same magnitudes as an npn at the mirrored bias.
    for (const key of ['ic', 'ib', 'ie', 'gm', 'rpi', 'ro'] as const) {
      expectRelativelyClose(p[key], n[key], 1e-9, key);
    }
    // The emitter current flows in: the source emitterBias delivers ie (passive sign: −ie through it).
    expectRelativelyClose(operatingPoint(c).current('emitterBias'), -p.ie, 1e-12, 'emitter current');
  });
});

describe('the bipolar transistor regions', () => {
  // The textbook definition by the bias of the two junctions (Sedra & Smith, from memory); a junction
  // counts as forward-biased above 16·n·Vt ≈ 0.41 V.
  const model: BjtModel = { polarity: 'npn' };
  it('is in cutoff with both junctions reverse-biased', () => {
    const q = biased(0, 5, model);
    expect(q.region).toBe('cutoff');
    expect(Math.abs(q.ic)).toBeLessThan(1e-11);
  });
  it('is forward-active with only the base-emitter junction forward-biased', () => {
    expect(biased(0.7, 5, model).region).toBe('forward-active');
  });
  it('is saturated with both junctions forward-biased', () => {
    const q = biased(0.7, 0.1, model);
    expect(q.region).toBe('saturation');
    // In saturation the collector takes less than β times the base current.
    expect(q.ic / q.ib).toBeLessThan(100);
  });
  it('is reverse-active with only the base-collector junction forward-biased', () => {
    // vbe = −4.3, vbc = 0.7: the emitter collects, so the current into the collector is negative.
    const q = biased(-4.3, -5, model);
    expect(q.region).toBe('reverse-active');
    expect(q.ic).toBeLessThan(0);
    expect(q.vbc).toBeCloseTo(0.7, 12);
  });
});

describe('the Widlar current source', () => {
  it('satisfies I_out·R_E = Vt·ln(I_ref/I_out) with matched transistors and a large β', () => {
    // R. J. Widlar, "Some circuit design techniques for linear integrated circuits", IEEE Trans.
    // Circuit Theory CT-12(4), 1965. The equation is solved here by bisection.
    const model: BjtModel = { polarity: 'npn', forwardBeta: 1e6 };
    const re = 5e3;
    const c = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 10 })
      .resistor('Rref', 'vcc', 'b', '9.3k')
      .bjt('Q1', { collector: 'b', base: 'b', emitter: GROUND }, model)
      .bjt('Q2', { collector: 'vcc', base: 'b', emitter: 'e' }, model)
      .resistor('Re', 'e', GROUND, re);
    const op = operatingPoint(c);
    const iref = op.bjt('Q1').ic;
    let lo = 1e-12;
    let hi = iref;
    for (let k = 0; k < 200; k++) {
      const mid = 0.5 * (lo + hi);
      if (mid * re - VT * Math.log(iref / mid) > 0) hi = mid;
      else lo = mid;
    }
    expectRelativelyClose(op.bjt('Q2').ic, 0.5 * (lo + hi), 1e-5, 'I_out');
    expect(op.bjt('Q2').ic).toBeLessThan(iref / 5);
  });
});

describe('the bipolar transistor with temperature', () => {
  it('gives g_m = I_C/Vt at the analysis temperature', () => {
    // Hybrid-π model (Sedra & Smith, from memory) with Vt = k·T/q.
    const c = new Circuit()
      .currentSource('baseDrive', GROUND, 'b', { dc: 1e-5 })
      .voltageSource('collectorBias', 'c', GROUND, { dc: 3 })
      .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, { polarity: 'npn' });
    const q = operatingPoint(c, { temperature: 350 }).bjt('Q1');
    expectRelativelyClose(q.gm, q.ic / thermalVoltage(350), 1e-7, 'g_m at 350 K');
    expectRelativelyClose(q.ic, 100 * 1e-5, 1e-6, 'β·I_B');
  });
});
