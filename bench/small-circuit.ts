/**
 * The cost of the library on a small circuit, where set-up rather than the solve decides: a
 * 10-element diode ladder (a 5 V supply, five resistors and four diodes to ground), solved by
 * `operatingPoint` on an unchanged circuit, by a prepared circuit, by one point of a `dcSweep`, and by
 * the floor: a dense Newton written by hand for this one circuit (nodal equations in the four
 * ladder nodes, Gaussian elimination, the same junction step limit and the same tolerances); and a
 * first call, the same circuit built anew and solved once (the building itself timed apart).
 *
 * Run: npx tsx bench/small-circuit.ts   (one JSON line: µs per solve and ratios to the floor)
 */
import { performance } from 'node:perf_hooks';
import { Circuit, dcSweep, GROUND, operatingPoint, prepareCircuit } from '../src/index.js';

const SUPPLY = 5;
const RESISTORS = [1e3, 2.2e3, 3.3e3, 4.7e3, 10e3];
const saturationCurrent = 1e-14;
const VT = (1.380649e-23 * 298.15) / 1.602176634e-19;

function ladder(): Circuit {
  const c = new Circuit().voltageSource('supply', 'n0', GROUND, { dc: SUPPLY });
  for (let k = 0; k < 4; k++) {
    c.resistor(`series${k}`, `n${k}`, `n${k + 1}`, RESISTORS[k]!).diode(`clamp${k}`, `n${k + 1}`, GROUND);
  }
  return c.resistor('tail', 'n4', GROUND, RESISTORS[4]!);
}

/** The floor: Newton on the four ladder nodes with dense elimination, written for this circuit only. */
const floorState = { v: new Float64Array(4), J: new Float64Array(16), f: new Float64Array(4) };
function handNewton(): number {
  const { v, J, f } = floorState;
  v.fill(0);
  const vCritical = VT * Math.log(VT / (Math.SQRT2 * saturationCurrent));
  for (let iteration = 0; iteration < 200; iteration++) {
    J.fill(0);
    for (let k = 0; k < 4; k++) {
      const left = k === 0 ? SUPPLY : v[k - 1]!;
      const gLeft = 1 / RESISTORS[k]!;
      const gRight = k < 3 ? 1 / RESISTORS[k + 1]! : 1 / RESISTORS[4]!;
      const right = k < 3 ? v[k + 1]! : 0;
      const e = Math.exp(v[k]! / VT);
      const gd = (saturationCurrent * e) / VT + 1e-12;
      f[k] = gLeft * (v[k]! - left) + gRight * (v[k]! - right) + saturationCurrent * (e - 1) + 1e-12 * v[k]!;
      J[5 * k] = gLeft + gRight + gd;
      if (k > 0) J[4 * k + k - 1] = -gLeft;
      if (k < 3) J[4 * k + k + 1] = -gRight;
    }
    // Solve J·dv = −f by elimination (tridiagonal here, done densely as a general small solve would).
    for (let c = 0; c < 4; c++) {
      for (let r = c + 1; r < 4; r++) {
        const m = J[4 * r + c]! / J[5 * c]!;
        if (m === 0) continue;
        for (let k = c; k < 4; k++) J[4 * r + k]! -= m * J[4 * c + k]!;
        f[r]! -= m * f[c]!;
      }
    }
    let converged = true;
    for (let r = 3; r >= 0; r--) {
      let s = -f[r]!;
      for (let k = r + 1; k < 4; k++) s -= J[4 * r + k]! * f[k]!;
      f[r] = s / J[5 * r]!; // f now holds the step
    }
    for (let k = 0; k < 4; k++) {
      const old = v[k]!;
      let next = old + f[k]!;
      if (next > vCritical && Math.abs(next - old) > 2 * VT) {
        next =
          old > 0 ? old + VT * Math.log(Math.max(1 + (next - old) / VT, 1e-300)) : VT * Math.log(next / VT);
      }
      if (Math.abs(next - old) > 1e-6 * Math.abs(next) + 1e-9) converged = false;
      v[k] = next;
    }
    if (converged) return v[3]!;
  }
  throw new Error('the hand-written Newton did not converge');
}

function microseconds(run: () => unknown, minimumMs = 400): number {
  // Warm up for as long as the timing runs: the first call's path (compile, ordering, set-up) is
  // long, and 200 calls left its figure moving between runs by a factor of two.
  const warm = performance.now();
  while (performance.now() - warm < minimumMs) for (let k = 0; k < 50; k++) run();
  let count = 0;
  const t0 = performance.now();
  while (performance.now() - t0 < minimumMs) {
    for (let k = 0; k < 50; k++) run();
    count += 50;
  }
  return ((performance.now() - t0) * 1000) / count;
}

const circuit = ladder();
const prepared = prepareCircuit(circuit);
const expected = operatingPoint(circuit).voltage('n4');
const hand = handNewton();
if (Math.abs(hand - expected) > 1e-6) throw new Error(`floor disagrees: ${hand} V against ${expected} V`);

const floorUs = microseconds(handNewton);
const operatingPointUs = microseconds(() => operatingPoint(circuit));
const preparedUs = microseconds(() => prepared.operatingPoint());
const sweepPointUs = microseconds(() => dcSweep(circuit, { source: 'supply', values: [SUPPLY] }));
// A first call: a circuit built anew and solved once (compile, ordering and set-up included), less
// the building, which is the caller's own code.
const buildUs = microseconds(ladder);
const firstCallUs = microseconds(() => operatingPoint(ladder())) - buildUs;
const round = (x: number) => Number(x.toPrecision(3));
console.log(
  JSON.stringify({
    circuit: 'diode ladder, 10 elements',
    floorUs: round(floorUs),
    operatingPointUs: round(operatingPointUs),
    preparedUs: round(preparedUs),
    sweepPointUs: round(sweepPointUs),
    buildUs: round(buildUs),
    firstCallUs: round(firstCallUs),
    operatingPointRatio: round(operatingPointUs / floorUs),
    preparedRatio: round(preparedUs / floorUs),
    firstCallRatio: round(firstCallUs / floorUs),
  }),
);
