/**
 * A feedback loop of three equal real poles and an inverting gain K: T(s) = K/(1 + sτ)³, measured at
 * the loop probe `loopBreak`. Its margins and closed-loop poles are known in closed form, so the
 * stability tests use it at several gains.
 */
import { Circuit, GROUND } from '../../src/index.js';

/** The loop with gain `gain`, sections of `r` Ω and `c` F (τ = r·c). */
export function threePoleLoop(gain: number, r = 1e3, c = 1e-9): Circuit {
  return new Circuit()
    .vcvs('invert', ['a', GROUND], [GROUND, 'fb'], gain)
    .resistor('R1', 'a', 'b', r)
    .capacitor('C1', 'b', GROUND, c)
    .vcvs('buffer1', ['d', GROUND], ['b', GROUND], 1)
    .resistor('R2', 'd', 'e', r)
    .capacitor('C2', 'e', GROUND, c)
    .vcvs('buffer2', ['g', GROUND], ['e', GROUND], 1)
    .resistor('R3', 'g', 'out', r)
    .capacitor('C3', 'out', GROUND, c)
    .loopProbe('loopBreak', 'out', 'fb');
}
