import { describe, expect, it } from 'vitest';
import { analyseMosfetStage, MOSFET_STAGE } from '../../examples/mosfet-stage.js';

// The bias from the square law (Shichman & Hodges, IEEE J. Solid-State Circuits 3(3), 1968) with the gate
// at 5 V·680k/1680k and id·R_S on the source: id = ½β(V_G − id·R_S − Vth)², the smaller root of the quadratic.
const BETA = 6e-3;
const VTH = 1.1;
const VG = (5 * 680e3) / 1680e3;
const sourceResistance = MOSFET_STAGE.sourceResistance;
const overdrive = (-1 + Math.sqrt(1 + 2 * BETA * sourceResistance * (VG - VTH))) / (BETA * sourceResistance);
const id = 0.5 * BETA * overdrive * overdrive;
const gm = BETA * overdrive;

describe('examples/mosfet-stage', () => {
  const s = analyseMosfetStage();

  it('biases the channel in saturation where the square law puts it', () => {
    expect(s.bias.region).toBe('saturation');
    expect(Math.abs(s.bias.id - id) / id).toBeLessThan(1e-6);
    expect(Math.abs(s.bias.overdrive - overdrive)).toBeLessThan(1e-6);
  });

  it('has the degenerated gain −g_m·R_D/(1 + g_m·R_S)', () => {
    // Sedra & Smith, Microelectronic Circuits, 7th ed., 2015, §7.6 (from memory).
    const expected = (-gm * MOSFET_STAGE.drainResistance) / (1 + gm * sourceResistance);
    expect(Math.abs(s.gain - expected) / Math.abs(expected)).toBeLessThan(2e-3);
  });

  it('judges the channel by x = v̂gs/V_ov with the square law’s bound x/2', () => {
    // v̂gs = v̂in/(1 + g_m·R_S) with the gate divider (405 kΩ) far above the 1 µF reactance at 10 kHz.
    const x = MOSFET_STAGE.carrierAmplitude / (1 + gm * sourceResistance) / overdrive;
    expect(Math.abs(s.normalized - x) / x).toBeLessThan(2e-3);
    expect(s.errorBound).toBeCloseTo(s.normalized / 2, 12);
    // The bound reaches the 5 % budget at x = 0.1.
    expect(Math.abs(s.maxCarrier - (MOSFET_STAGE.carrierAmplitude * 0.1) / x) / s.maxCarrier).toBeLessThan(
      2e-3,
    );
  });
});
