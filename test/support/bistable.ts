/**
 * A bistable of two cross-coupled npn transistors (each collector feeding the other's base through
 * 10 kΩ, 1 kΩ collector loads, 5 V supply): a circuit with three DC solutions, two stable and one
 * balanced, for the tests of the operating-point search and its initial guess.
 */
import { type BjtModel, Circuit, GROUND } from '../../src/index.js';

/**
 * The cross-coupled bistable: nodes vcc, c1, c2, b1, b2; transistors Q1 (c1, b1) and Q2 (c2, b2).
 *
 * @param model - the npn model both transistors share
 */
export function crossCoupledBistable(model: BjtModel): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
    .resistor('Rc1', 'vcc', 'c1', '1k')
    .resistor('Rc2', 'vcc', 'c2', '1k')
    .resistor('Rx1', 'c1', 'b2', '10k')
    .resistor('Rx2', 'c2', 'b1', '10k')
    .resistor('Rb1', 'b1', GROUND, '10k')
    .resistor('Rb2', 'b2', GROUND, '10k')
    .bjt('Q1', { collector: 'c1', base: 'b1', emitter: GROUND }, model)
    .bjt('Q2', { collector: 'c2', base: 'b2', emitter: GROUND }, model);
}
