import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, type MosfetModel, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';

const BETA = 2e-3;

/** A MOSFET with gate, drain and body voltages (to the grounded source) set by ideal sources. */
function biased(vgs: number, vds: number, model: MosfetModel, vbs = 0) {
  const c = new Circuit()
    .voltageSource('gateBias', 'g', GROUND, { dc: vgs })
    .voltageSource('drainBias', 'd', GROUND, { dc: vds })
    .voltageSource('bodyBias', 'bulk', GROUND, { dc: vbs })
    .mosfet('underTest', { drain: 'd', gate: 'g', source: GROUND, body: 'bulk' }, model);
  const op = operatingPoint(c);
  return { report: op.mosfet('underTest'), drainSource: op.current('drainBias') };
}

describe('the MOSFET square law', () => {
  // Shichman & Hodges, "Modeling and simulation of insulated-gate field-effect transistor switching
  // circuits", IEEE J. Solid-State Circuits 3(3), 1968, as docs/devices.md, "MOSFET", writes it.
  const model: MosfetModel = {
    polarity: 'nmos',
    gainFactor: BETA,
    thresholdVoltage: 0.7,
    channelLengthModulation: 0.02,
  };

  // id includes the default 1e-12 S across the channel: 5 pA of 1.6 mA, 3e-9, hence 1e-8 below.
  it('gives id = ½·β·V_ov²·(1 + λ·vds) and g_m = 2·I_D/V_ov in saturation', () => {
    // g_m = 2·I_D/V_ov (Sedra & Smith, Microelectronic Circuits, from memory).
    const { report: m, drainSource } = biased(1.9, 5, model);
    const vov = 1.2;
    expect(m.region).toBe('saturation');
    expectRelativelyClose(m.id, 0.5 * BETA * vov * vov * (1 + 0.02 * 5), 1e-8, 'id');
    expectRelativelyClose(m.gm, (2 * m.id) / vov, 1e-8, 'g_m');
    expectRelativelyClose(m.gds, (0.02 * m.id) / (1 + 0.02 * 5), 1e-8, 'g_ds = λ·I_D/(1 + λ·vds)');
    expectRelativelyClose(m.overdrive, vov, 1e-12, 'overdrive');
    // The drain supply delivers the drain current (passive sign: −id through it).
    expectRelativelyClose(-drainSource, m.id, 1e-9, 'drain current through the supply');
  });

  it('gives id = β·(V_ov·vds − ½·vds²)·(1 + λ·vds) in the triode region', () => {
    const { report: m } = biased(1.9, 0.4, model);
    expect(m.region).toBe('triode');
    expectRelativelyClose(m.id, BETA * (1.2 * 0.4 - 0.08) * (1 + 0.02 * 0.4), 1e-9, 'id');
    expectRelativelyClose(m.gm, BETA * 0.4 * (1 + 0.02 * 0.4), 1e-9, 'g_m = β·vds·(1 + λ·vds)');
  });

  it('passes no drain current in cutoff', () => {
    const { report: m } = biased(0.5, 5, model);
    expect(m.region).toBe('cutoff');
    expect(m.gm).toBe(0);
    // Only the junction conductance across the channel: 1e-12 S × 5 V.
    expect(Math.abs(m.id)).toBeLessThan(1e-11);
  });

  it('raises the threshold by γ·(√(φ − vbs) − √φ) with the body reverse-biased', () => {
    const body: MosfetModel = { ...model, bodyEffect: 0.5, surfacePotential: 0.6 };
    const { report: m } = biased(2.5, 5, body, -3);
    const vth = 0.7 + 0.5 * (Math.sqrt(0.6 + 3) - Math.sqrt(0.6));
    expectRelativelyClose(m.thresholdVoltage, vth, 1e-12, 'Vth');
    expectRelativelyClose(m.id, 0.5 * BETA * (2.5 - vth) ** 2 * (1 + 0.02 * 5), 1e-8, 'id');
    // g_mb = g_m·γ/(2·√(φ − vbs)) (Sedra & Smith, from memory).
    expectRelativelyClose(m.gmb, (m.gm * 0.5) / (2 * Math.sqrt(3.6)), 1e-9, 'g_mb');
  });

  it('exchanges drain and source when vds < 0', () => {
    // The law is symmetric: with vds < 0 the drain terminal acts as the source, so
    // id = −β·((vgd − Vth)·vsd − ½·vsd²)·(1 + λ·vsd) in the triode region here.
    const { report: m } = biased(3, -1, model);
    expect(m.vds).toBe(-1);
    expectRelativelyClose(m.id, -BETA * ((4 - 0.7) * 1 - 0.5) * (1 + 0.02), 1e-9, 'id');
    expect(m.region).toBe('triode');
  });
});

describe('the pmos transistor', () => {
  it('has id positive and vgs, vds and its threshold negative in saturation', () => {
    // docs/building-circuits.md, "Sign conventions", and docs/devices.md, "MOSFET": the pmos obeys the nmos
    // law in vsg, vsd, vsb.
    const model: MosfetModel = {
      polarity: 'pmos',
      gainFactor: BETA,
      thresholdVoltage: -0.7,
      channelLengthModulation: 0.02,
    };
    const { report: p } = biased(-1.9, -5, model);
    const { report: n } = biased(1.9, 5, { ...model, polarity: 'nmos', thresholdVoltage: 0.7 });
    expect(p.vgs).toBe(-1.9);
    expect(p.vds).toBe(-5);
    expect(p.thresholdVoltage).toBe(-0.7);
    expect(p.region).toBe('saturation');
    expect(p.id).toBeGreaterThan(0);
    for (const key of ['id', 'gm', 'gds', 'overdrive'] as const)
      expectRelativelyClose(p[key], n[key], 1e-9, key);
  });

  it('defaults to a threshold of −0.7 V', () => {
    // docs/devices.md, "MOSFET" (parameter table).
    expect(biased(-1, -1, { polarity: 'pmos' }).report.thresholdVoltage).toBe(-0.7);
  });
});
