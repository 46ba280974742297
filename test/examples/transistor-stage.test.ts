import { describe, expect, it } from 'vitest';
import { measureStage, STAGE } from '../../examples/transistor-stage.js';

const parallel = (...rs: number[]) => 1 / rs.reduce((sum, r) => sum + 1 / r, 0);
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

// Hybrid-π analysis of the common-emitter stage with bypassed emitter and large coupling capacitors
// (Sedra & Smith, Microelectronic Circuits, 7th ed., 2015, §7.5; from memory):
// A_v = −g_m·(R_C ‖ r_o ‖ R_L), R_in = R1 ‖ R2 ‖ r_π, R_out = R_C ‖ r_o.
describe('examples/transistor-stage', () => {
  const s = measureStage();
  const { gm, rpi, ro } = s.transistor;

  it('biases the transistor in forward-active operation', () => {
    expect(s.transistor.region).toBe('forward-active');
  });

  it('has the mid-band gain −g_m·(R_C ‖ r_o ‖ R_L)', () => {
    const expected = -gm * parallel(STAGE.collectorResistance, ro, STAGE.loadResistance);
    expect(relative(s.gain, expected)).toBeLessThan(5e-3);
  });

  it('presents R1 ‖ R2 ‖ r_π to the sensor and R_C ‖ r_o to the comparator', () => {
    expect(
      relative(s.inputImpedance, parallel(STAGE.topResistance, STAGE.bottomResistance, rpi)),
    ).toBeLessThan(5e-3);
    expect(relative(s.outputImpedance, parallel(STAGE.collectorResistance, ro))).toBeLessThan(5e-3);
  });
});
