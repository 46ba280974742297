import { describe, expect, it } from 'vitest';
import { acAnalysis, Circuit, GROUND, operatingPoint } from '../../src/index.js';

describe("a diode's small-signal current", () => {
  // Kirchhoff's current law: in a series loop every element carries the same current (common
  // practice, no source); with and without the diode's own series resistance and capacitance.
  it.each([0, 12])('equals the current of the resistor in series with it (series resistance %d Ω)', (rs) => {
    const circuit = new Circuit()
      .voltageSource('input', 'in', GROUND, { dc: 5, ac: 1 })
      .resistor('Rfeed', 'in', 'anode', '1k')
      .diode('D1', 'anode', GROUND, { seriesResistance: rs, junctionCapacitance: '10n', transitTime: '5n' });
    const ac = acAnalysis(operatingPoint(circuit), { frequencies: [0, 1e3, 1e6] });
    const diode = ac.current('D1');
    const resistor = ac.current('Rfeed');
    for (let k = 0; k < 3; k++) {
      expect(diode[k]!.sub(resistor[k]!).abs()).toBeLessThan(1e-12 * resistor[k]!.abs());
    }
  });

  // At 0 Hz the junction is its dynamic conductance 1/r_d (the small-signal diode model,
  // Sedra & Smith, Microelectronic Circuits, ch. 4, from memory): i = v_j / r_d.
  it('is the junction voltage over r_d at 0 Hz', () => {
    const circuit = new Circuit()
      .voltageSource('input', 'in', GROUND, { dc: 2, ac: 1 })
      .resistor('Rfeed', 'in', 'anode', '2.2k')
      .diode('D1', 'anode', GROUND);
    const op = operatingPoint(circuit);
    const ac = acAnalysis(op, { frequencies: [0] });
    const expected = ac.voltage('anode')[0]!.div(op.diode('D1').resistance);
    expect(ac.current('D1')[0]!.sub(expected).abs()).toBeLessThan(1e-12 * expected.abs());
  });
});
