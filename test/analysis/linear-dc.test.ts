import { describe, expect, it } from 'vitest';
import { Circuit, type ErrorCode, GROUND, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

/**
 * Linear DC circuits against their textbook closed forms. A linear solve is exact up to rounding, so
 * the tolerance is a few hundred units in the last place of a double (common practice, no source).
 */
const TOLERANCE = 1e-12;

/** Expect `actual` to equal `expected` to TOLERANCE, relative (absolute 1e-15 near zero). */
function expectClose(actual: number, expected: number, what: string): void {
  if (Math.abs(expected) < 1e-12) {
    expect(Math.abs(actual), `${what}: got ${actual}, expected ${expected}`).toBeLessThan(1e-15);
    return;
  }
  expectRelativelyClose(actual, expected, TOLERANCE, what);
}

/** Parallel combination of resistances. */
const parallel = (...rs: number[]): number => 1 / rs.reduce((sum, r) => sum + 1 / r, 0);

describe('linear DC operating point', () => {
  describe('resistive networks', () => {
    it('divides a voltage in the ratio of the resistances', () => {
      // Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed., 2013, §2.7, voltage
      // division v2 = v·R2/(R1 + R2) (from memory)
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 10 })
          .resistor('R1', 'in', 'out', '1k')
          .resistor('R2', 'out', GROUND, '3k'),
      );
      expectClose(op.voltage('out'), (10 * 3000) / 4000, 'voltage at out');
      expectClose(op.voltage('in', 'out'), (10 * 1000) / 4000, 'voltage in − out');
      expectClose(op.current('R1'), 10 / 4000, 'current in R1');
    });

    it('finds the galvanometer current of a Wheatstone bridge off balance from its Thevenin equivalent', () => {
      // Alexander & Sadiku, 5th ed., 2013, §4.10.2 (from memory): seen from the galvanometer the
      // bridge is Vth = Vs·(R2/(R1 + R2) − R4/(R3 + R4)) behind Rth = R1‖R2 + R3‖R4
      const [vs, r1, r2, r3, r4, rg] = [12, 1e3, 2.2e3, 3.3e3, 4.7e3, 150];
      const op = operatingPoint(
        new Circuit()
          .voltageSource('source', 'top', GROUND, { dc: vs })
          .resistor('R1', 'top', 'a', r1)
          .resistor('R2', 'a', GROUND, r2)
          .resistor('R3', 'top', 'b', r3)
          .resistor('R4', 'b', GROUND, r4)
          .resistor('Rg', 'a', 'b', rg),
      );
      const vth = vs * (r2 / (r1 + r2) - r4 / (r3 + r4));
      const rth = parallel(r1, r2) + parallel(r3, r4);
      expect(Math.abs(vth)).toBeGreaterThan(0.1); // the bridge is off balance
      expectClose(op.current('Rg'), vth / (rth + rg), 'galvanometer current');
    });

    it('carries no galvanometer current in a balanced bridge', () => {
      // Alexander & Sadiku, 5th ed., 2013, §4.10.2 (from memory): R1/R2 = R3/R4 balances the bridge
      const op = operatingPoint(
        new Circuit()
          .voltageSource('source', 'top', GROUND, { dc: 12 })
          .resistor('R1', 'top', 'a', 1e3)
          .resistor('R2', 'a', GROUND, 2e3)
          .resistor('R3', 'top', 'b', 3e3)
          .resistor('R4', 'b', GROUND, 6e3)
          .resistor('Rg', 'a', 'b', 150),
      );
      expect(Math.abs(op.current('Rg'))).toBeLessThan(1e-15);
    });

    it('adds the responses to two sources acting alone (superposition)', () => {
      // Alexander & Sadiku, 5th ed., 2013, §4.3 (from memory): with the voltage source alone vx = v·R2/(R1 + R2);
      // with the current source alone vx = i·(R1‖R2); together their sum
      const [v1, i1, r1, r2] = [12, 2e-3, 4e3, 6e3];
      const circuit = (v: number, i: number) =>
        new Circuit()
          .voltageSource('source', 'a', GROUND, { dc: v })
          .resistor('R1', 'a', 'x', r1)
          .resistor('R2', 'x', GROUND, r2)
          .currentSource('injection', GROUND, 'x', { dc: i });
      const both = operatingPoint(circuit(v1, i1)).voltage('x');
      const voltageAlone = operatingPoint(circuit(v1, 0)).voltage('x');
      const currentAlone = operatingPoint(circuit(0, i1)).voltage('x');
      expectClose(voltageAlone, (v1 * r2) / (r1 + r2), 'vx with the voltage source alone');
      expectClose(currentAlone, i1 * parallel(r1, r2), 'vx with the current source alone');
      expectClose(both, voltageAlone + currentAlone, 'vx with both sources');
    });

    describe('Thevenin and Norton equivalents', () => {
      // Alexander & Sadiku, 5th ed., 2013, §4.5 and §4.6 (from memory): a linear two-terminal network
      // is a source Vth behind Rth, or In = Vth/Rth in parallel with Rth; Vth is the open-circuit
      // voltage, In the short-circuit current. Network: 10 V through 2 kΩ to node p, 3 kΩ from p to
      // ground, 1 mA injected at p, 500 Ω from p to the port node t.
      const [vs, ra, rb, is, rc] = [10, 2e3, 3e3, 1e-3, 500];
      const vth = (vs * rb) / (ra + rb) + is * parallel(ra, rb);
      const rth = parallel(ra, rb) + rc;
      const network = () =>
        new Circuit()
          .voltageSource('source', 's', GROUND, { dc: vs })
          .resistor('Ra', 's', 'p', ra)
          .resistor('Rb', 'p', GROUND, rb)
          .currentSource('injection', GROUND, 'p', { dc: is })
          .resistor('Rc', 'p', 't', rc);

      it('gives the open-circuit voltage Vth and the short-circuit current Vth/Rth', () => {
        const open = operatingPoint(network());
        expectClose(open.voltage('t'), vth, 'open-circuit voltage');
        // A 0 V source as an ammeter: its current flows from t through it to ground.
        const shorted = operatingPoint(network().voltageSource('short', 't', GROUND, { dc: 0 }));
        expectClose(shorted.current('short'), vth / rth, 'short-circuit current');
      });

      it('loads like its Thevenin and its Norton equivalent', () => {
        for (const rl of [100, 1e3, 47e3]) {
          const full = operatingPoint(network().resistor('Rl', 't', GROUND, rl)).current('Rl');
          const thevenin = operatingPoint(
            new Circuit()
              .voltageSource('thevenin', 'e', GROUND, { dc: vth })
              .resistor('Rth', 'e', 't', rth)
              .resistor('Rl', 't', GROUND, rl),
          ).current('Rl');
          const norton = operatingPoint(
            new Circuit()
              .currentSource('norton', GROUND, 't', { dc: vth / rth })
              .resistor('Rn', 't', GROUND, rth)
              .resistor('Rl', 't', GROUND, rl),
          ).current('Rl');
          expectClose(full, vth / (rth + rl), `load current for Rl = ${rl}`);
          expectClose(thevenin, full, `Thevenin equivalent for Rl = ${rl}`);
          expectClose(norton, full, `Norton equivalent for Rl = ${rl}`);
        }
      });
    });

    it('weights the bits of an R-2R ladder in powers of two', () => {
      // P. Horowitz and W. Hill, The Art of Electronics, 3rd ed., 2015, §13.2 (from memory): the
      // open-circuit output of an N-bit R-2R ladder is Vref·Σ b_k·2^(k−N), k = 0 the least significant
      const bits = 5;
      const vref = 3.2;
      const ladder = (code: number) => {
        const c = new Circuit().resistor('Rterm', 'n0', GROUND, '20k');
        for (let k = 0; k < bits; k++) {
          const on = (code >> k) & 1;
          c.voltageSource(`bit${k}`, `b${k}`, GROUND, { dc: on * vref }).resistor(
            `R2_${k}`,
            `n${k}`,
            `b${k}`,
            '20k',
          );
          if (k > 0) c.resistor(`R_${k}`, `n${k - 1}`, `n${k}`, '10k');
        }
        return operatingPoint(c).voltage(`n${bits - 1}`);
      };
      for (let k = 0; k < bits; k++) {
        expectClose(ladder(1 << k), vref * 2 ** (k - bits), `bit ${k} alone`);
      }
      for (const code of [0, 0b10110, 0b01011, 0b11111]) {
        expectClose(ladder(code), (vref * code) / 2 ** bits, `code ${code.toString(2)}`);
      }
    });
  });

  describe('controlled sources', () => {
    it('amplifies a divided voltage with a vcvs', () => {
      // Alexander & Sadiku, 5th ed., 2013, §2.2 (from memory): v_out = μ·v_ctrl
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 1 })
          .resistor('Rs', 'in', 'c', '1k')
          .resistor('Rp', 'c', GROUND, '9k')
          .vcvs('buffer', ['out', GROUND], ['c', GROUND], -25)
          .resistor('Rl', 'out', GROUND, '2k'),
      );
      expectClose(op.voltage('out'), -25 * 0.9, 'voltage at out');
      // The output branch current flows from outPlus through the source to outMinus.
      expectClose(op.current('buffer'), (25 * 0.9) / 2000, 'current in buffer');
    });

    it('drives a load with the current of a vccs, in the direction of the documented sign convention', () => {
      // Alexander & Sadiku, 5th ed., 2013, §2.2 (from memory): i = gm·v_ctrl; docs/building-circuits.md, "Elements":
      // gm·V(ctrl) flows from outFrom through the source into outTo
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 2 })
          .vccs('transconductor', [GROUND, 'out'], ['in', GROUND], '5m')
          .resistor('Rl', 'out', GROUND, '1k'),
      );
      expectClose(op.voltage('out'), 2 * 5e-3 * 1e3, 'voltage at out');
      expectClose(op.current('transconductor'), 2 * 5e-3, 'current in transconductor');
    });

    it('solves a vccs that feeds back on its own control voltage', () => {
      // nodal analysis with a dependent source (Alexander & Sadiku, 5th ed., 2013, §3.2, from memory):
      // the source current i_s = vx/R + gm·vx, so vx = i_s/(1/R + gm)
      const [is, r, gm] = [1e-3, 10e3, 4e-4];
      const op = operatingPoint(
        new Circuit()
          .currentSource('injection', GROUND, 'x', { dc: is })
          .resistor('R', 'x', GROUND, r)
          .vccs('transconductor', ['x', GROUND], ['x', GROUND], gm),
      );
      expectClose(op.voltage('x'), is / (1 / r + gm), 'voltage at x');
    });

    it('sets a ccvs output from the current of its controlling voltage source', () => {
      // Alexander & Sadiku, 5th ed., 2013, §2.2 (from memory): v = r·i_ctrl; the source current
      // follows the passive sign convention of docs/building-circuits.md, "Sign conventions"
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 5 })
          .resistor('R1', 'in', GROUND, '2.5k')
          .ccvs('senseAmp', ['out', GROUND], 'supply', '1k')
          .resistor('Rl', 'out', GROUND, '10k'),
      );
      const iV1 = -5 / 2500;
      expectClose(op.current('supply'), iV1, 'current in supply');
      expectClose(op.voltage('out'), 1000 * iV1, 'voltage at out');
    });

    it('mirrors the current of its controlling voltage source with a cccs', () => {
      // Alexander & Sadiku, 5th ed., 2013, §2.2 (from memory): i = β·i_ctrl
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 5 })
          .resistor('R1', 'in', GROUND, '1k')
          .cccs('mirror', [GROUND, 'out'], 'supply', 3)
          .resistor('Rl', 'out', GROUND, '500'),
      );
      const iV1 = -5 / 1000;
      expectClose(op.current('mirror'), 3 * iV1, 'current in mirror');
      expectClose(op.voltage('out'), 3 * iV1 * 500, 'voltage at out');
    });

    it('senses the current of an inductor, a short at DC, with a cccs', () => {
      // Alexander & Sadiku, 5th ed., 2013, §6.4 (from memory): an inductor carries V/R at DC
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 4 })
          .inductor('L1', 'in', 'x', '10m')
          .resistor('R1', 'x', GROUND, '2k')
          .cccs('mirror', [GROUND, 'out'], 'L1', 10)
          .resistor('Rl', 'out', GROUND, '100'),
      );
      expectClose(op.current('L1'), 4 / 2000, 'current in L1');
      expectClose(op.voltage('out'), 10 * (4 / 2000) * 100, 'voltage at out');
    });
  });

  describe('ideal op-amp', () => {
    // Sedra and Smith, Microelectronic Circuits, 7th ed., 2015, §2.2 to §2.4 (from memory)

    it('inverts with gain −Rf/Rin and supplies the output current', () => {
      const op = operatingPoint(
        new Circuit()
          .voltageSource('input', 'in', GROUND, { dc: 0.7 })
          .resistor('Rin', 'in', 'minus', '1k')
          .resistor('Rf', 'minus', 'out', '10k')
          .opAmp('U1', { plus: GROUND, minus: 'minus', output: 'out' })
          .resistor('Rl', 'out', GROUND, '2k'),
      );
      const vout = -10 * 0.7;
      expectClose(op.voltage('out'), vout, 'voltage at out');
      expect(Math.abs(op.voltage('minus'))).toBeLessThan(1e-15); // virtual ground
      // docs/building-circuits.md, "Elements": the op-amp current flows out of its output into the
      // circuit, here into Rl and Rf.
      expectClose(op.current('U1'), vout / 2000 + vout / 10000, 'current in U1');
    });

    it('amplifies without inversion with gain 1 + Rf/Rg', () => {
      const op = operatingPoint(
        new Circuit()
          .voltageSource('input', 'in', GROUND, { dc: -0.25 })
          .opAmp('U1', { plus: 'in', minus: 'minus', output: 'out' })
          .resistor('Rf', 'out', 'minus', '39k')
          .resistor('Rg', 'minus', GROUND, '10k'),
      );
      expectClose(op.voltage('out'), -0.25 * (1 + 39 / 10), 'voltage at out');
      expectClose(op.current('U1'), (-0.25 * (1 + 39 / 10)) / 49e3, 'current in U1');
    });

    it('sums weighted inputs: vout = −Rf·(v1/R1 + v2/R2 + v3/R3)', () => {
      const op = operatingPoint(
        new Circuit()
          .voltageSource('inputA', 'a', GROUND, { dc: 1 })
          .voltageSource('inputB', 'b', GROUND, { dc: -2 })
          .voltageSource('inputC', 'c', GROUND, { dc: 0.5 })
          .resistor('R1', 'a', 'sum', '10k')
          .resistor('R2', 'b', 'sum', '20k')
          .resistor('R3', 'c', 'sum', '5k')
          .resistor('Rf', 'sum', 'out', '15k')
          .opAmp('U1', { plus: GROUND, minus: 'sum', output: 'out' }),
      );
      expectClose(op.voltage('out'), -15e3 * (1 / 10e3 + -2 / 20e3 + 0.5 / 5e3), 'voltage at out');
    });

    it('takes a difference: vout = v2·(R4/(R3 + R4))·(1 + R2/R1) − v1·R2/R1', () => {
      const [v1, v2, r1, r2, r3, r4] = [1.5, 2, 10e3, 47e3, 12e3, 33e3];
      const op = operatingPoint(
        new Circuit()
          .voltageSource('inputA', 'a', GROUND, { dc: v1 })
          .voltageSource('inputB', 'b', GROUND, { dc: v2 })
          .resistor('R1', 'a', 'minus', r1)
          .resistor('R2', 'minus', 'out', r2)
          .resistor('R3', 'b', 'plus', r3)
          .resistor('R4', 'plus', GROUND, r4)
          .opAmp('U1', { plus: 'plus', minus: 'minus', output: 'out' }),
      );
      expectClose(
        op.voltage('out'),
        v2 * (r4 / (r3 + r4)) * (1 + r2 / r1) - (v1 * r2) / r1,
        'voltage at out',
      );
    });

    it('amplifies only the difference when R4/R3 = R2/R1', () => {
      const op = operatingPoint(
        new Circuit()
          .voltageSource('inputA', 'a', GROUND, { dc: 3.1 })
          .voltageSource('inputB', 'b', GROUND, { dc: 3.4 })
          .resistor('R1', 'a', 'minus', '10k')
          .resistor('R2', 'minus', 'out', '100k')
          .resistor('R3', 'b', 'plus', '10k')
          .resistor('R4', 'plus', GROUND, '100k')
          .opAmp('U1', { plus: 'plus', minus: 'minus', output: 'out' }),
      );
      expectClose(op.voltage('out'), 10 * (3.4 - 3.1), 'voltage at out');
    });
  });

  describe('finite-gain op-amp at DC', () => {
    // Sedra and Smith, 7th ed., 2015, §2.3.2 and §11.3 (from memory): with open-loop gain A and
    // feedback factor β the closed-loop gain is A/(1 + Aβ); the output resistance falls to
    // about Ro/(1 + Aβ).
    const [a, rf, rg] = [1000, 9e3, 1e3];
    const beta = rg / (rf + rg);

    it('has the closed-loop gain A/(1 + Aβ) of a non-inverting amplifier', () => {
      const op = operatingPoint(
        new Circuit()
          .voltageSource('input', 'in', GROUND, { dc: 0.1 })
          .opAmp('U1', { plus: 'in', minus: 'minus', output: 'out' }, { openLoopGain: a })
          .resistor('Rf', 'out', 'minus', rf)
          .resistor('Rg', 'minus', GROUND, rg),
      );
      expectClose(op.voltage('out'), (0.1 * a) / (1 + a * beta), 'voltage at out');
      // the error voltage between the inputs is v(out)/A
      expectClose(op.voltage('in', 'minus'), op.voltage('out') / a, 'voltage at in − voltage at minus');
    });

    it('falls short of the ideal gain by the factor 1/(1 + 1/(Aβ)) and approaches it as A grows', () => {
      const gains = [1e2, 1e4, 1e6].map((gain) => {
        const op = operatingPoint(
          new Circuit()
            .voltageSource('input', 'in', GROUND, { dc: 1 })
            .opAmp('U1', { plus: 'in', minus: 'minus', output: 'out' }, { openLoopGain: gain })
            .resistor('Rf', 'out', 'minus', rf)
            .resistor('Rg', 'minus', GROUND, rg),
        );
        const closed = op.voltage('out');
        expectClose(closed, 1 / beta / (1 + 1 / (gain * beta)), `closed-loop gain for A = ${gain}`);
        return closed;
      });
      expect(gains[0]!).toBeLessThan(gains[1]!);
      expect(gains[1]!).toBeLessThan(gains[2]!);
      expect(gains[2]!).toBeLessThan(1 / beta);
    });

    it('loses output voltage across its output resistance as the load grows heavier', () => {
      // Model of docs/devices.md, "Op-amp": v(out) = A·(v+ − v−) − Ro·i_out. With the load RL and
      // the feedback divider (conductance Gf = 1/(Rf + Rg)) at the output, i_out = v(out)·(1/RL + Gf), so
      // v(out) = A·vin/(1 + Aβ + Ro·(1/RL + Gf)) (derived from the model; Sedra & Smith, 7th ed.,
      // 2015, §11.3, from memory, for the feedback view)
      const ro = 75;
      const vin = 0.2;
      const gf = 1 / (rf + rg);
      const vout = (rl: number) =>
        operatingPoint(
          new Circuit()
            .voltageSource('input', 'in', GROUND, { dc: vin })
            .opAmp(
              'U1',
              { plus: 'in', minus: 'minus', output: 'out' },
              { openLoopGain: a, outputResistance: ro },
            )
            .resistor('Rf', 'out', 'minus', rf)
            .resistor('Rg', 'minus', GROUND, rg)
            .resistor('Rl', 'out', GROUND, rl),
        ).voltage('out');
      const light = vout(1e6);
      const heavy = vout(100);
      expectClose(light, (a * vin) / (1 + a * beta + ro * (1 / 1e6 + gf)), 'voltage at out, RL = 1 MΩ');
      expectClose(heavy, (a * vin) / (1 + a * beta + ro * (1 / 100 + gf)), 'voltage at out, RL = 100 Ω');
      // The closed-loop output resistance from the two loads, against Ro/(1 + Aβ).
      const iLight = light / 1e6;
      const iHeavy = heavy / 100;
      const rout = (light - heavy) / (iHeavy - iLight);
      expectRelativelyClose(rout, ro / (1 + a * beta), 1e-3, 'closed-loop output resistance');
    });
  });

  describe('reactive elements at DC', () => {
    it('treats a capacitor as an open circuit carrying no current', () => {
      // Alexander & Sadiku, 5th ed., 2013, §6.2 (from memory)
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 9 })
          .resistor('R1', 'in', 'a', '1k')
          .capacitor('C1', 'a', GROUND, '10u')
          .resistor('R2', 'a', GROUND, '2k'),
      );
      expectClose(op.voltage('a'), (9 * 2) / 3, 'voltage at a');
      expect(op.current('C1')).toBe(0);
    });

    it('treats an inductor as a short circuit carrying the loop current', () => {
      // Alexander & Sadiku, 5th ed., 2013, §6.4 (from memory)
      const op = operatingPoint(
        new Circuit()
          .voltageSource('supply', 'in', GROUND, { dc: 9 })
          .resistor('R1', 'in', 'a', '1k')
          .inductor('L1', 'a', 'b', '1m')
          .resistor('R2', 'b', GROUND, '2k'),
      );
      expect(Math.abs(op.voltage('a', 'b'))).toBeLessThan(1e-15);
      expectClose(op.current('L1'), 9 / 3000, 'current in L1');
    });
  });

  describe('iterations', () => {
    it('solves a linear circuit in one step', () => {
      // docs/analyses.md, "Strategies": one solve, iterations 1
      const circuits = [
        new Circuit().voltageSource('supply', 'a', GROUND, { dc: 1 }).resistor('R1', 'a', GROUND, 1),
        new Circuit()
          .currentSource('bias', GROUND, 'a', { dc: 1 })
          .resistor('R1', 'a', GROUND, 1)
          .opAmp('U1', { plus: 'a', minus: 'o', output: 'o' })
          .vccs('transconductor', [GROUND, 'g'], ['o', GROUND], 1)
          .resistor('R2', 'g', GROUND, 1),
      ];
      for (const c of circuits) expect(operatingPoint(c).iterations).toBe(1);
    });
  });

  describe('sign conventions of op.current', () => {
    // docs/building-circuits.md, "Sign conventions"; the passive sign convention of Alexander & Sadiku,
    // 5th ed., 2013, §1.5

    const circuit = () =>
      new Circuit()
        .voltageSource('supply', 'p', GROUND, { dc: 6 })
        .resistor('Rab', 'p', 'm', '1k')
        .resistor('Rba', GROUND, 'm', '2k')
        .currentSource('sink', 'm', GROUND, { dc: '-1m' })
        .currentSource('feed', GROUND, 'q', { dc: '0.5m' })
        .resistor('Rq', 'q', GROUND, '4k');

    it('gives a resistor current from its first node to its second', () => {
      const op = operatingPoint(circuit());
      expectClose(op.current('Rab'), (op.voltage('p') - op.voltage('m')) / 1000, 'current in Rab');
      expectClose(op.current('Rba'), (0 - op.voltage('m')) / 2000, 'current in Rba');
      // nodal equation at m: (6 − vm)/1k = vm/2k + i_sink, i_sink = −1 mA leaving m through the source
      const vm = (6 / 1000 + 1e-3) / (1 / 1000 + 1 / 2000);
      expectClose(op.voltage('m'), vm, 'voltage at m');
    });

    it('gives a voltage source that delivers power a current of the opposite sign to its voltage', () => {
      const op = operatingPoint(circuit());
      const i = op.current('supply');
      expect(i).toBeLessThan(0);
      expectClose(i, -op.current('Rab'), 'current in supply');
      expect(op.voltage('p') * i).toBeLessThan(0); // absorbed power v·i < 0: delivered
    });

    it('gives a current source its set value', () => {
      const op = operatingPoint(circuit());
      expect(op.current('sink')).toBe(-1e-3);
      expect(op.current('feed')).toBe(0.5e-3);
      expectClose(op.voltage('q'), 0.5e-3 * 4000, 'voltage at q: feed flows from ground into q');
    });
  });

  describe('accessors', () => {
    const solved = () =>
      operatingPoint(
        new Circuit()
          .voltageSource('supply', 'a', GROUND, { dc: 1 })
          .resistor('R1', 'a', GROUND, 1e3)
          .diode('D1', 'a', 'k')
          .resistor('R2', 'k', GROUND, 1e3),
      );

    function expectRejected(read: () => unknown, code: ErrorCode, name: string): void {
      expectQuiescentError(read, code, `'${name}'`);
    }

    it('rejects a node the circuit lacks with unknown-node, naming it', () => {
      // docs/building-circuits.md, "Errors"
      const op = solved();
      expectRejected(() => op.voltage('nowhere'), 'unknown-node', 'nowhere');
      expectRejected(() => op.voltage('a', 'elsewhere'), 'unknown-node', 'elsewhere');
      expectRejected(() => op.voltage('R1'), 'unknown-node', 'R1');
    });

    it('rejects an element the circuit lacks, or one without a device report, with unknown-element', () => {
      // docs/building-circuits.md, "Errors"; docs/analyses.md, "Results": op.device answers for diodes and transistors
      const op = solved();
      expectRejected(() => op.current('R9'), 'unknown-element', 'R9');
      expectRejected(() => op.current('a'), 'unknown-element', 'a');
      expectRejected(() => op.device('R1'), 'unknown-element', 'R1');
      expectRejected(() => op.device('nothing'), 'unknown-element', 'nothing');
    });

    it('answers for ground as a node at 0 V', () => {
      // docs/analyses.md, "Results": voltages are taken with respect to GROUND by default
      const op = solved();
      expect(op.voltage(GROUND)).toBe(0);
      expectClose(op.voltage(GROUND, 'a'), -1, 'voltage gnd − a');
    });
  });
});
