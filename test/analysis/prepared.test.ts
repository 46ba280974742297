/**
 * The prepared circuit: compiled once, reused by every analysis of an unchanged circuit, and solved
 * again after value changes without compiling. Expected numbers come from closed forms (sources named
 * beside each check) or from a fresh compile of the same values.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { conditionsAt, solveFromCurrent, startFromGuess } from '../../src/analysis/operating-point.js';
import { resolveOptions } from '../../src/analysis/options.js';
import {
  acAnalysis,
  type BjtModel,
  Circuit,
  dcSweep,
  GROUND,
  operatingPoint,
  PreparedCircuit,
  prepareCircuit,
} from '../../src/index.js';
import { compileCount } from '../../src/mna/system.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

/** Element values below 1e-60 are refused at the boundary (docs/analyses.md, "Arguments"): draw 0 instead. */
const noSubnormal = (v: number): number => (Math.abs(v) < 1e-30 ? 0 : v);

/** A sensor bridge's reference arm: a supply, two resistors and a diode clamp across the lower one. */
function referenceArm(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'top', GROUND, { dc: 5, ac: 1 })
    .resistor('upper', 'top', 'mid', '10k')
    .resistor('lower', 'mid', GROUND, '10k')
    .diode('clamp', 'mid', GROUND, { saturationCurrent: '1p' })
    .capacitor('filter', 'mid', GROUND, '100n');
}

describe('the cached compile behind operatingPoint', () => {
  it('does not compile an unchanged circuit a second time, for any analysis', () => {
    const circuit = referenceArm();
    const before = compileCount();
    const op = operatingPoint(circuit);
    operatingPoint(circuit);
    operatingPoint(circuit, { temperature: 320 });
    dcSweep(circuit, { source: 'supply', values: [1, 2, 3] });
    acAnalysis(op, { frequencies: [10, 100] });
    expect(compileCount() - before).toBe(1);
  });

  it('compiles again once the circuit has changed', () => {
    const circuit = referenceArm();
    const before = compileCount();
    const first = operatingPoint(circuit).voltage('mid');
    circuit.resistor('load', 'mid', GROUND, '10k');
    const second = operatingPoint(circuit).voltage('mid');
    expect(compileCount() - before).toBe(2);
    // A third 10 kΩ in parallel lowers the divider's Thevenin resistance (common practice, no source).
    expect(second).toBeLessThan(first);
  });

  it("keeps its cache off the circuit's own properties, so a copy or a comparison never meets it", () => {
    // Common practice, no source: a cache is invisible to the object's own keys, clones and JSON.
    const solved = referenceArm();
    operatingPoint(solved);
    expect(Object.keys(solved)).toEqual(Object.keys(referenceArm()));
    expect(structuredClone(solved)).toEqual(structuredClone(referenceArm()));
    expect(JSON.stringify(solved)).toBe(JSON.stringify(referenceArm()));
  });

  it('gives a repeated solve the same answer as the first, bit for bit', () => {
    const circuit = referenceArm();
    const a = operatingPoint(circuit);
    const b = operatingPoint(circuit);
    expect(Array.from(b.x)).toEqual(Array.from(a.x));
  });
});

describe('results of one circuit at several temperatures', () => {
  it('each read at its own temperature, whatever was solved since', () => {
    // Two results share the compiled devices of their circuit; a device brings its temperature
    // constants to the conditions of the result read (docs/analyses.md, "Prepared circuits").
    // Expected numbers: the same readings from circuits solved alone (common practice, no source).
    const arm = referenceArm;
    const cold = operatingPoint(arm(), { temperature: 250 });
    const coldAc = acAnalysis(cold, { frequencies: [1e3] });
    const hot = operatingPoint(arm(), { temperature: 400 });
    const hotAc = acAnalysis(hot, { frequencies: [1e3] });
    const shared = arm();
    const sharedCold = operatingPoint(shared, { temperature: 250 });
    const sharedColdAc = acAnalysis(sharedCold, { frequencies: [1e3] });
    const sharedHot = operatingPoint(shared, { temperature: 400 });
    const sharedHotAc = acAnalysis(sharedHot, { frequencies: [1e3] });
    // Read the cold results after the hot ones were solved on the same devices, and the other way.
    expect(sharedColdAc.current('clamp')[0]!.re).toBe(coldAc.current('clamp')[0]!.re);
    expect(sharedCold.diode('clamp').resistance).toBe(cold.diode('clamp').resistance);
    expect(sharedHotAc.current('clamp')[0]!.re).toBe(hotAc.current('clamp')[0]!.re);
    expect(sharedCold.diode('clamp').resistance).not.toBe(sharedHot.diode('clamp').resistance);
  });
});

describe('prepareCircuit', () => {
  it('solves a divider after a value change as the closed form says, without compiling again', () => {
    // v(mid) = V·R2/(R1 + R2) (voltage divider, common practice, no source).
    const circuit = new Circuit()
      .voltageSource('supply', 'top', GROUND, { dc: 12 })
      .resistor('upper', 'top', 'mid', '3k')
      .resistor('lower', 'mid', GROUND, '1k');
    const prepared = prepareCircuit(circuit);
    const before = compileCount();
    for (const lower of [1e3, 2e3, 5e3, 9e3]) {
      prepared.setValue('lower', 'resistance', lower);
      expect(prepared.operatingPoint().voltage('mid')).toBeCloseTo((12 * lower) / (3e3 + lower), 12);
    }
    prepared.setValue('supply', 'dc', '6 V');
    expect(prepared.operatingPoint().voltage('mid')).toBeCloseTo((6 * 9e3) / 12e3, 12);
    expect(compileCount() - before).toBe(0);
    expect(prepared.compilations).toBe(1);
  });

  it('leaves the circuit and earlier results as they were', () => {
    const circuit = referenceArm();
    const prepared = prepareCircuit(circuit);
    const before = prepared.operatingPoint();
    const mid = before.voltage('mid');
    prepared.setValue('upper', 'resistance', '1k');
    const after = prepared.operatingPoint();
    expect(after.voltage('mid')).toBeGreaterThan(mid);
    expect(before.voltage('mid')).toBe(mid);
    expect(before.diode('clamp').current).toBeCloseTo(operatingPoint(circuit).diode('clamp').current, 15);
    expect(circuit.element('upper')).toMatchObject({ resistance: 10e3 });
  });

  it('reads values back, model defaults included, and restores them on reset', () => {
    const prepared = prepareCircuit(referenceArm());
    expect(prepared.value('clamp', 'emissionCoefficient')).toBe(1);
    prepared.setValue('clamp', 'emissionCoefficient', 1.8);
    expect(prepared.value('clamp', 'emissionCoefficient')).toBe(1.8);
    const changed = prepared.operatingPoint().voltage('mid');
    prepared.reset();
    expect(prepared.value('clamp', 'emissionCoefficient')).toBe(1);
    expect(prepared.operatingPoint().voltage('mid')).not.toBeCloseTo(changed, 3);
  });

  it('compiles again when a value adds an unknown, and still answers', () => {
    const prepared = prepareCircuit(referenceArm());
    prepared.setValue('clamp', 'seriesResistance', 100);
    expect(prepared.compilations).toBe(2);
    const op = prepared.operatingPoint();
    const d = op.diode('clamp');
    // The series resistance drops i·R between the terminals and the junction (Ohm's law).
    expect(d.voltage - d.junctionVoltage).toBeCloseTo(d.current * 100, 9);
  });

  it('is accepted by operatingPoint and by the AC analysis of its operating points', () => {
    const prepared = prepareCircuit(referenceArm());
    expect(prepared).toBeInstanceOf(PreparedCircuit);
    const op = operatingPoint(prepared);
    const ac = acAnalysis(op, { frequencies: [1] });
    expect(ac.voltage('mid')[0]!.abs()).toBeGreaterThan(0);
  });

  it('names the element or parameter it cannot change', () => {
    const prepared = prepareCircuit(referenceArm());
    expectQuiescentError(() => prepared.setValue('missing', 'resistance', 1), 'unknown-element', 'missing');
    expectQuiescentError(() => prepared.setValue('upper', 'capacitance', 1), 'invalid-value', 'upper');
    expectQuiescentError(() => prepared.setValue('upper', 'resistance', -5), 'invalid-value', 'upper');
    expectQuiescentError(() => prepared.setValue('clamp', 'saturationCurrent', 0), 'invalid-value', 'clamp');
  });
});

describe('value changes on a prepared circuit', () => {
  /** A ladder of resistors with a diode at every rung: random values, one topology. */
  const ladderValues = fc.record({
    supply: fc.double({ min: -10, max: 10, noNaN: true }).map(noSubnormal),
    series: fc.array(fc.double({ min: 10, max: 1e5, noNaN: true }), { minLength: 4, maxLength: 4 }),
    shunt: fc.array(fc.double({ min: 10, max: 1e5, noNaN: true }), { minLength: 4, maxLength: 4 }),
    saturation: fc.array(fc.double({ min: 1e-15, max: 1e-9, noNaN: true }), { minLength: 4, maxLength: 4 }),
  });
  type Ladder = typeof ladderValues extends fc.Arbitrary<infer T> ? T : never;

  function ladder(v: Ladder): Circuit {
    const c = new Circuit().voltageSource('supply', 'n0', GROUND, { dc: v.supply });
    for (let k = 0; k < 4; k++) {
      c.resistor(`series${k}`, `n${k}`, `n${k + 1}`, v.series[k]!)
        .resistor(`shunt${k}`, `n${k + 1}`, GROUND, v.shunt[k]!)
        .diode(`rung${k}`, `n${k + 1}`, GROUND, { saturationCurrent: v.saturation[k]! });
    }
    return c;
  }

  it('give the same answers as a fresh compile of the changed circuit', () => {
    // Property (common practice, no source): a value change must be indistinguishable from
    // building the circuit with that value.
    const prepared = prepareCircuit(
      ladder({
        supply: 1,
        series: [1, 1, 1, 1],
        shunt: [1, 1, 1, 1],
        saturation: [1e-14, 1e-14, 1e-14, 1e-14],
      }),
    );
    fc.assert(
      fc.property(ladderValues, (v) => {
        prepared.setValue('supply', 'dc', v.supply);
        for (let k = 0; k < 4; k++) {
          prepared.setValues([
            { element: `series${k}`, parameter: 'resistance', value: v.series[k]! },
            { element: `shunt${k}`, parameter: 'resistance', value: v.shunt[k]! },
            { element: `rung${k}`, parameter: 'saturationCurrent', value: v.saturation[k]! },
          ]);
        }
        const changed = prepared.operatingPoint();
        const fresh = operatingPoint(ladder(v));
        for (let k = 1; k <= 4; k++) {
          const expected = fresh.voltage(`n${k}`);
          expect(Math.abs(changed.voltage(`n${k}`) - expected)).toBeLessThanOrEqual(
            1e-6 * Math.abs(expected) + 1e-8,
          );
        }
      }),
      { seed: 20261204, numRuns: 200 },
    );
    expect(prepared.compilations).toBe(1);
  });
});

describe('values changed in place (as a Monte Carlo sample changes them)', () => {
  /** A level shifter for a sensor line: every kind whose devices take new values in place. */
  const shifterValues = fc.record({
    supply: fc.double({ min: 8, max: 15, noNaN: true }),
    bias: fc.double({ min: 1e-5, max: 1e-3, noNaN: true }),
    feed: fc.double({ min: 1e3, max: 1e5, noNaN: true }),
    collector: fc.double({ min: 500, max: 5e3, noNaN: true }),
    beta: fc.double({ min: 50, max: 400, noNaN: true }),
    early: fc.double({ min: 20, max: 200, noNaN: true }),
    clampSeries: fc.double({ min: 1, max: 100, noNaN: true }),
    clampSaturation: fc.double({ min: 1e-15, max: 1e-10, noNaN: true }),
    gainFactor: fc.double({ min: 1e-4, max: 1e-2, noNaN: true }),
    threshold: fc.double({ min: 0.3, max: 1.2, noNaN: true }),
    sense: fc.double({ min: 1e-5, max: 1e-3, noNaN: true }),
    temperature: fc.double({ min: 250, max: 380, noNaN: true }),
  });
  type Shifter = typeof shifterValues extends fc.Arbitrary<infer T> ? T : never;

  function shifter(v: Shifter): Circuit {
    return new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: v.supply })
      .currentSource('bias', 'vcc', 'base', { dc: v.bias })
      .resistor('feed', 'base', GROUND, v.feed)
      .resistor('collectorLoad', 'vcc', 'out', v.collector)
      .bjt(
        'shift',
        { collector: 'out', base: 'base', emitter: 'tail' },
        { polarity: 'npn', forwardBeta: v.beta, earlyVoltage: v.early },
      )
      .resistor('tailLoad', 'tail', GROUND, '1k')
      .diode('clamp', 'out', 'vcc', { seriesResistance: v.clampSeries, saturationCurrent: v.clampSaturation })
      .mosfet(
        'follower',
        { drain: 'vcc', gate: 'out', source: 'level' },
        { polarity: 'nmos', gainFactor: v.gainFactor, thresholdVoltage: v.threshold },
      )
      .resistor('levelLoad', 'level', GROUND, '10k')
      .vccs('sense', ['level', GROUND], ['tail', GROUND], v.sense)
      .capacitor('hold', 'level', GROUND, '1u');
  }

  it('give the same answers as a fresh compile, and never touch a result returned before', () => {
    // Property (common practice, no source): a value change must be indistinguishable from
    // building the circuit with that value, however it is carried out.
    const nominal: Shifter = {
      supply: 12,
      bias: 1e-4,
      feed: 1e4,
      collector: 2e3,
      beta: 150,
      early: 80,
      clampSeries: 10,
      clampSaturation: 1e-14,
      gainFactor: 1e-3,
      threshold: 0.7,
      sense: 1e-4,
      temperature: 300.15,
    };
    const prepared = prepareCircuit(shifter(nominal));
    const before = prepared.operatingPoint();
    const levelBefore = before.voltage('level');
    const names = prepared.elements.map((e) => e.name);
    fc.assert(
      fc.property(shifterValues, (v) => {
        const records = shifter(v).elements;
        prepared.revalueInPlace(
          records.map((r) => names.indexOf(r.name)),
          records,
        );
        const options = resolveOptions({ temperature: v.temperature });
        const solver = prepared.solver(options);
        startFromGuess(solver);
        const changed = solveFromCurrent(solver, conditionsAt(v.temperature, options));
        const fresh = operatingPoint(shifter(v), { temperature: v.temperature });
        for (const node of ['base', 'out', 'tail', 'level']) {
          const expected = fresh.voltage(node);
          expect(Math.abs(changed.voltage(node) - expected)).toBeLessThanOrEqual(
            1e-6 * Math.abs(expected) + 1e-8,
          );
        }
        const ic = fresh.bjt('shift').ic;
        expect(Math.abs(changed.bjt('shift').ic - ic)).toBeLessThanOrEqual(1e-6 * Math.abs(ic) + 1e-12);
      }),
      { seed: 20261204, numRuns: 100 },
    );
    expect(prepared.compilations).toBe(1);
    expect(before.voltage('level')).toBe(levelBefore);
    expect(prepared.operatingPoint().voltage('level')).not.toBe(levelBefore);
  });

  it('change one of several transistors built from one model object, and leave the others as they were', () => {
    // Two stages built from one model object share one parsed model and one table of values; an
    // in-place change of one stage's β must reach that stage only (common practice, no source:
    // the answer must equal a circuit built with the two values given apart).
    const shared = { polarity: 'npn', forwardBeta: 100, earlyVoltage: 60 } as const;
    const pair = (first: BjtModel, second: BjtModel) =>
      new Circuit()
        .voltageSource('supply', 'vcc', GROUND, { dc: 9 })
        .resistor('biasTop', 'vcc', 'base', '470k')
        .resistor('biasBottom', 'base', GROUND, '100k')
        .bjt('input', { collector: 'in', base: 'base', emitter: GROUND }, first)
        .resistor('inputLoad', 'vcc', 'in', '10k')
        .bjt('mirror', { collector: 'out', base: 'base', emitter: GROUND }, second)
        .resistor('mirrorLoad', 'vcc', 'out', '10k');
    const circuit = pair(shared, shared);
    const input = circuit.elements.findIndex((e) => e.name === 'input');
    const mirror = circuit.elements.findIndex((e) => e.name === 'mirror');
    expect((circuit.elements[input] as { model: object }).model).toBe(
      (circuit.elements[mirror] as { model: object }).model,
    );
    const prepared = prepareCircuit(circuit);
    prepared.operatingPoint();
    const changed = pair({ ...shared, forwardBeta: 300 }, shared);
    prepared.revalueInPlace([input], [changed.elements[input]!]);
    const options = resolveOptions({});
    const solver = prepared.solver(options);
    startFromGuess(solver);
    const solved = solveFromCurrent(solver, conditionsAt(options.temperature, options));
    const fresh = operatingPoint(changed);
    for (const node of ['in', 'out', 'base']) {
      expect(solved.voltage(node)).toBeCloseTo(fresh.voltage(node), 9);
    }
    // Same junction, same collector current: the base currents tell the two β apart (ib = ic/β).
    for (const stage of ['input', 'mirror']) {
      expect(solved.bjt(stage).ib).toBeCloseTo(fresh.bjt(stage).ib, 12);
    }
    expect(solved.bjt('mirror').ib / solved.bjt('input').ib).toBeCloseTo(3, 2);
  });

  it('bind a new device where a value adds an unknown, and still answer as a fresh compile', () => {
    // A terminal resistance appearing needs an internal node: the in-place change gives way to a
    // new compile (common practice, no source).
    const arm = referenceArm();
    const prepared = prepareCircuit(arm);
    const changed = new Circuit()
      .voltageSource('supply', 'top', GROUND, { dc: 5, ac: 1 })
      .resistor('upper', 'top', 'mid', '10k')
      .resistor('lower', 'mid', GROUND, '10k')
      .diode('clamp', 'mid', GROUND, { saturationCurrent: '1p', seriesResistance: 50 })
      .capacitor('filter', 'mid', GROUND, '100n');
    prepared.revalueInPlace([3], [changed.elements[3]!]);
    expect(prepared.compilations).toBe(2);
    expect(prepared.operatingPoint().voltage('mid')).toBeCloseTo(operatingPoint(changed).voltage('mid'), 12);
  });
});
