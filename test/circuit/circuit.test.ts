import { describe, expect, it } from 'vitest';
import {
  type BjtModel,
  Circuit,
  type ErrorCode,
  GROUND,
  operatingPoint,
  portImpedance,
  QuiescentError,
} from '../../src/index.js';

/**
 * What the builder promises (docs/building-circuits.md, introduction and "Elements"): every method
 * checks its own arguments at once, returns the circuit, and rejects bad input with a
 * QuiescentError whose message names the element. The ranges checked here
 * (a resistance is positive, a capacitance or inductance is not negative, a unit symbol must fit
 * the quantity) are the physical ones of any circuits text, e.g. C. K. Alexander and M. N. O.
 * Sadiku, Fundamentals of Electric Circuits, 5th ed., 2013, ch. 2 and 6 (from memory); the SI
 * symbols are those of BIPM, The International System of Units, 9th ed., 2019, Table 4.
 */

/** Runs `build` and returns the QuiescentError it throws, failing the test when it does not throw. */
function rejection(build: () => unknown): QuiescentError {
  try {
    build();
  } catch (error) {
    expect(error).toBeInstanceOf(QuiescentError);
    return error as QuiescentError;
  }
  throw new Error('expected the call to throw a QuiescentError');
}

/** Expects `build` to throw `code` with a message that contains every one of `names`. */
function expectRejected(build: () => unknown, code: ErrorCode, ...names: string[]): QuiescentError {
  const error = rejection(build);
  expect(error.code, error.message).toBe(code);
  for (const name of names) expect(error.message).toContain(name);
  return error;
}

describe('Circuit builder', () => {
  describe('accepts valid input', () => {
    it('adds one element of every kind, in order, and returns the circuit from each call so calls chain', () => {
      // common practice, no source: a fluent builder returns `this`
      const c = new Circuit();
      const returned = [
        c.resistor('R1', 'a', GROUND, '4.7k'),
        c.capacitor('C1', 'a', 'b', '10uF'),
        c.inductor('L1', 'b', GROUND, '2.2 mH'),
        c.voltageSource('supply', 'a', GROUND, { dc: 5, ac: { magnitude: '1 V', phase: 30 } }),
        c.currentSource('bias', GROUND, 'b', { dc: '1mA', ac: 0.5 }),
        c.vcvs('buffer', ['e', GROUND], ['a', 'b'], 10),
        c.vccs('transconductor', ['f', GROUND], ['a', GROUND], '2mS'),
        c.ccvs('senseAmp', ['h', GROUND], 'supply', '1k'),
        c.cccs('mirror', ['k', GROUND], 'L1', 3),
        c.opAmp('U1', { plus: 'a', minus: 'o', output: 'o' }),
        c.opAmp('U2', { plus: 'a', minus: 'p', output: 'p' }, { openLoopGain: 2e5, outputResistance: 75 }),
        c.diode('D1', 'a', 'd', { saturationCurrent: '10f', emissionCoefficient: 1.8 }),
        c.bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, { polarity: 'npn', forwardBeta: 150 }),
        c.mosfet('switch', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos' }),
        c.mosfet('pullUp', { drain: 'd', gate: 'g', source: 's', body: 'w' }, { polarity: 'pmos' }),
      ];
      for (const r of returned) expect(r).toBe(c);
      expect(c.elements.map((e) => e.name)).toEqual([
        'R1',
        'C1',
        'L1',
        'supply',
        'bias',
        'buffer',
        'transconductor',
        'senseAmp',
        'mirror',
        'U1',
        'U2',
        'D1',
        'Q1',
        'switch',
        'pullUp',
      ]);
    });

    it('stores values in SI units, parsed from prefixed strings', () => {
      // SI prefixes: BIPM, SI Brochure, 9th ed., 2019, Table 7 (k = 1e3, u = µ = 1e-6, m = 1e-3)
      const c = new Circuit()
        .resistor('R1', 'a', GROUND, '4.7k')
        .capacitor('C1', 'a', GROUND, '10µF')
        .inductor('L1', 'a', GROUND, '2.2 mH')
        .voltageSource('supply', 'a', GROUND, { dc: '1.5', ac: { magnitude: '100m', phase: -45 } });
      expect(c.element('R1')).toMatchObject({ kind: 'resistor', a: 'a', b: GROUND, resistance: 4700 });
      expect((c.element('C1') as { capacitance: number }).capacitance).toBeCloseTo(10e-6, 18);
      expect((c.element('L1') as { inductance: number }).inductance).toBeCloseTo(2.2e-3, 15);
      expect(c.element('supply')).toMatchObject({ dc: 1.5, ac: { magnitude: 0.1, phase: -45 } });
    });

    it('defaults a source to no DC value and no AC signal', () => {
      // docs/building-circuits.md, "Sources and their AC excitation": dc and ac are optional (common practice, no source)
      const c = new Circuit().voltageSource('supply', 'a', GROUND).currentSource('bias', 'a', GROUND, {});
      expect(c.element('supply')).toMatchObject({ dc: 0, ac: { magnitude: 0, phase: 0 } });
      expect(c.element('bias')).toMatchObject({ dc: 0, ac: { magnitude: 0, phase: 0 } });
    });

    it('accepts zero for a capacitance and an inductance, and negative source values and gains', () => {
      // docs/building-circuits.md, "Elements": zero is a valid capacitance; a source or a controlled gain
      // may have either sign
      // (Alexander & Sadiku, 5th ed., 2013, §2.2 and §4.2, from memory)
      const c = new Circuit()
        .capacitor('C1', 'a', GROUND, 0)
        .inductor('L1', 'a', 'b', 0)
        .voltageSource('supply', 'a', GROUND, { dc: -12 })
        .vcvs('buffer', ['o', GROUND], ['a', GROUND], -4);
      expect(c.elements).toHaveLength(4);
    });

    it('stores a negative zero as zero, which JSON can carry', () => {
      // ECMA-404, 2017: JSON has no negative zero, so a stored −0 would not survive a round trip
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: -0, ac: { magnitude: -0, phase: -0 } })
        .vcvs('buffer', ['o', GROUND], ['a', GROUND], '-0');
      expect(Object.is((c.element('supply') as { dc: number }).dc, 0)).toBe(true);
      expect(Object.is((c.element('supply') as { ac: { magnitude: number } }).ac.magnitude, 0)).toBe(true);
      expect(Object.is((c.element('supply') as { ac: { phase: number } }).ac.phase, 0)).toBe(true);
      expect(Object.is((c.element('buffer') as { gain: number }).gain, 0)).toBe(true);
    });

    it('ties the MOSFET body to its source when no body is given, and keeps the polarity', () => {
      // docs/building-circuits.md, "Elements": body defaults to source
      const c = new Circuit().mosfet('switch', { drain: 'd', gate: 'g', source: 's' }, { polarity: 'pmos' });
      expect(c.element('switch')).toMatchObject({ source: 's', body: 's', polarity: 'pmos' });
    });

    it('lists the nodes in order of first appearance, ground included', () => {
      // common practice, no source
      const c = new Circuit().resistor('R1', 'in', 'mid', 1).resistor('R2', 'mid', GROUND, 1);
      expect(c.nodes).toEqual(['in', 'mid', GROUND]);
    });

    it('keeps its records frozen, so a value cannot change without the checks', () => {
      // common practice, no source: checked data is immutable
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1, ac: 1 })
        .diode('D1', 'a', GROUND, { saturationCurrent: 1e-14 });
      expect(Object.isFrozen(c.element('supply'))).toBe(true);
      expect(Object.isFrozen((c.element('supply') as { ac: object }).ac)).toBe(true);
      expect(Object.isFrozen((c.element('D1') as { model: object }).model)).toBe(true);
    });
  });

  describe('rejects bad names', () => {
    it.each([
      ['an empty element name', () => new Circuit().resistor('', 'a', 'b', 1)],
      ['a number as element name', () => new Circuit().resistor(7 as unknown as string, 'a', 'b', 1)],
    ])('rejects %s with invalid-circuit', (_, build) => {
      // docs/building-circuits.md, "Elements": element names are non-empty strings
      expectRejected(build, 'invalid-circuit', 'name');
    });

    it('rejects an empty node name, naming the element and the terminal', () => {
      // docs/building-circuits.md, "Elements": node names are non-empty strings
      expectRejected(() => new Circuit().resistor('R1', '', 'b', 1), 'invalid-circuit', 'R1.a');
      expectRejected(() => new Circuit().capacitor('C1', 'a', '', 1), 'invalid-circuit', 'C1.b');
      expectRejected(
        () => new Circuit().voltageSource('supply', undefined as unknown as string, GROUND),
        'invalid-circuit',
        'supply.plus',
      );
      expectRejected(
        () => new Circuit().currentSource('bias', GROUND, null as unknown as string),
        'invalid-circuit',
        'bias.to',
      );
      expectRejected(() => new Circuit().diode('D1', 'a', ''), 'invalid-circuit', 'D1.cathode');
    });

    it('rejects an empty controlling-element name of a ccvs or cccs', () => {
      // docs/building-circuits.md, "Elements": the controlling element is named
      expectRejected(
        () => new Circuit().ccvs('senseAmp', ['a', GROUND], '', 1),
        'invalid-circuit',
        'senseAmp.control',
      );
      expectRejected(
        () => new Circuit().cccs('mirror', ['a', GROUND], '', 1),
        'invalid-circuit',
        'mirror.control',
      );
    });
  });

  describe('rejects duplicate names', () => {
    it('rejects a second element of the same name with duplicate-name, whatever its kind', () => {
      // docs/building-circuits.md, "Elements": element names are unique within a circuit
      const c = new Circuit().resistor('taken', 'a', GROUND, 1);
      const error = expectRejected(() => c.capacitor('taken', 'a', GROUND, 1e-9), 'duplicate-name', 'taken');
      expect(error.details).toEqual({ code: 'duplicate-name', name: 'taken' });
      expectRejected(() => c.voltageSource('taken', 'a', GROUND), 'duplicate-name', 'taken');
      expectRejected(
        () => c.bjt('taken', { collector: 'c', base: 'b', emitter: 'e' }, { polarity: 'npn' }),
        'duplicate-name',
        'taken',
      );
      expect(c.elements).toHaveLength(1);
    });

    it('allows a node and an element to share a name', () => {
      // common practice, no source: nodes and elements live in separate name spaces
      const c = new Circuit().resistor('out', 'out', GROUND, 1);
      expect(c.nodes).toContain('out');
    });
  });

  describe('rejects bad values with invalid-value naming the element and parameter', () => {
    it.each([
      ['a zero resistance', 0],
      ['a negative resistance', -5],
      ['a negative resistance string', '-1k'],
      ['a capacitance unit on a resistance', '10F'],
      ['a voltage unit on a resistance', '3 V'],
      ['NaN', Number.NaN],
      ['Infinity', Number.POSITIVE_INFINITY],
      ['-Infinity', Number.NEGATIVE_INFINITY],
      ['an unparsable string', '1..2k'],
      ['an empty string', ''],
    ])('rejects %s as a resistance', (_, value) => {
      // Alexander & Sadiku, 5th ed., 2013, §2.2 (from memory): a physical resistance is positive
      const error = expectRejected(
        () => new Circuit().resistor('R7', 'a', 'b', value),
        'invalid-value',
        'R7.resistance',
      );
      expect(error.details).toMatchObject({ code: 'invalid-value', path: ['R7', 'resistance'] });
    });

    it('rejects a boolean or an object as a resistance', () => {
      // common practice, no source: a value is a number or a value string
      expectRejected(
        () => new Circuit().resistor('R1', 'a', 'b', true as unknown as number),
        'invalid-value',
        'R1',
      );
      expectRejected(
        () => new Circuit().resistor('R1', 'a', 'b', {} as unknown as number),
        'invalid-value',
        'R1',
      );
    });

    it.each([
      ['capacitor', () => new Circuit().capacitor('C3', 'a', 'b', -1e-9), 'C3.capacitance'],
      ['capacitor', () => new Circuit().capacitor('C3', 'a', 'b', '1kΩ'), 'C3.capacitance'],
      ['capacitor', () => new Circuit().capacitor('C3', 'a', 'b', Number.NaN), 'C3.capacitance'],
      ['inductor', () => new Circuit().inductor('L3', 'a', 'b', '-1m'), 'L3.inductance'],
      ['inductor', () => new Circuit().inductor('L3', 'a', 'b', '1 F'), 'L3.inductance'],
      ['voltage source', () => new Circuit().voltageSource('drive', 'a', 'b', { dc: '5 A' }), 'drive.dc'],
      [
        'voltage source',
        () => new Circuit().voltageSource('drive', 'a', 'b', { dc: Number.NaN }),
        'drive.dc',
      ],
      ['voltage source', () => new Circuit().voltageSource('drive', 'a', 'b', { ac: -1 }), 'drive.ac'],
      [
        'voltage source',
        () => new Circuit().voltageSource('drive', 'a', 'b', { ac: { magnitude: 1, phase: Number.NaN } }),
        'drive.ac.phase',
      ],
      [
        'current source',
        () => new Circuit().currentSource('sink', 'a', 'b', { dc: Number.POSITIVE_INFINITY }),
        'sink.dc',
      ],
      ['current source', () => new Circuit().currentSource('sink', 'a', 'b', { dc: '2 V' }), 'sink.dc'],
      ['vcvs', () => new Circuit().vcvs('buffer', ['a', 'b'], ['c', 'd'], Number.NaN), 'buffer.gain'],
      [
        'vccs',
        () => new Circuit().vccs('transconductor', ['a', 'b'], ['c', 'd'], '2 Ω'),
        'transconductor.transconductance',
      ],
      ['ccvs', () => new Circuit().ccvs('senseAmp', ['a', 'b'], 'supply', '1 S'), 'senseAmp.transresistance'],
      [
        'cccs',
        () => new Circuit().cccs('mirror', ['a', 'b'], 'supply', Number.NEGATIVE_INFINITY),
        'mirror.gain',
      ],
    ])('rejects a bad value of a %s (%#)', (_, build, path) => {
      // ranges: Alexander & Sadiku, 5th ed., 2013, ch. 6 (C, L ≥ 0; from memory); units: SI Brochure,
      // 9th ed., 2019, Table 4 (F capacitance, H inductance, V voltage, A current, S conductance)
      expectRejected(build, 'invalid-value', path);
    });

    it('leaves the circuit unchanged when a call is rejected, so the name stays free', () => {
      // common practice, no source: a failed call has no effect
      const c = new Circuit();
      expect(() => c.resistor('R1', 'a', 'b', 0)).toThrow(QuiescentError);
      expect(c.elements).toHaveLength(0);
      expect(c.resistor('R1', 'a', 'b', 1)).toBe(c);
    });
  });

  describe('rejects malformed source settings', () => {
    it('rejects an unknown source setting with invalid-circuit naming it', () => {
      // docs/building-circuits.md, "Sources and their AC excitation": a source takes { dc?, ac? }
      expectRejected(
        () => new Circuit().voltageSource('supply', 'a', GROUND, { dc: 1, amplitude: 2 } as never),
        'invalid-circuit',
        'supply.amplitude',
      );
      expectRejected(
        () => new Circuit().currentSource('bias', 'a', GROUND, { ac: { magnitude: 1, delay: 2 } } as never),
        'invalid-circuit',
        'bias.ac.delay',
      );
    });

    it('rejects a source setting that is not an object', () => {
      // docs/building-circuits.md, "Sources and their AC excitation": a source takes { dc?, ac? }
      expectRejected(
        () => new Circuit().voltageSource('supply', 'a', GROUND, 5 as never),
        'invalid-circuit',
        'supply',
      );
      expectRejected(
        () => new Circuit().currentSource('bias', 'a', GROUND, null as never),
        'invalid-circuit',
        'bias',
      );
      expectRejected(
        () => new Circuit().voltageSource('supply', 'a', GROUND, { ac: [1, 0] } as never),
        'invalid-circuit',
        'supply.ac',
      );
    });
  });

  describe('rejects bad terminal maps', () => {
    it('rejects output and control pairs that are not two node names', () => {
      // docs/building-circuits.md, "Elements": out and control are [plus, minus] pairs
      expectRejected(
        () => new Circuit().vcvs('buffer', ['a'] as unknown as [string, string], ['b', 'c'], 1),
        'invalid-circuit',
        'buffer.out',
      );
      expectRejected(
        () =>
          new Circuit().vccs('transconductor', ['a', 'b'], ['b', 'c', 'd'] as unknown as [string, string], 1),
        'invalid-circuit',
        'transconductor.control',
      );
      expectRejected(
        () => new Circuit().ccvs('senseAmp', 'ab' as unknown as [string, string], 'supply', 1),
        'invalid-circuit',
        'senseAmp.out',
      );
      expectRejected(
        () => new Circuit().cccs('mirror', ['a', ''], 'supply', 1),
        'invalid-circuit',
        'mirror.out[1]',
      );
    });

    it('rejects an op-amp terminal map with a missing or an unknown terminal', () => {
      // docs/building-circuits.md, "Elements": op-amp terminals are { plus, minus, output }
      expectRejected(
        () => new Circuit().opAmp('U1', { plus: 'a', minus: 'b' } as never),
        'invalid-circuit',
        'U1.output',
      );
      expectRejected(
        () => new Circuit().opAmp('U1', { plus: 'a', minus: 'b', output: 'c', supply: 'v' } as never),
        'invalid-circuit',
        'U1.supply',
      );
      expectRejected(() => new Circuit().opAmp('U1', ['a', 'b', 'c'] as never), 'invalid-circuit', 'U1');
    });

    it('rejects transistor terminal maps with a missing or an unknown terminal', () => {
      // docs/building-circuits.md, "Elements": bjt { collector, base, emitter }; mosfet { drain, gate, source, body? }
      expectRejected(
        () => new Circuit().bjt('Q1', { collector: 'c', base: 'b' } as never, { polarity: 'npn' }),
        'invalid-circuit',
        'Q1.emitter',
      );
      expectRejected(
        () =>
          new Circuit().bjt('Q1', { collector: 'c', base: 'b', emitter: 'e', body: 'x' } as never, {
            polarity: 'npn',
          }),
        'invalid-circuit',
        'Q1.body',
      );
      expectRejected(
        () => new Circuit().mosfet('switch', { drain: 'd', gate: 'g' } as never, { polarity: 'nmos' }),
        'invalid-circuit',
        'switch.source',
      );
      expectRejected(
        () =>
          new Circuit().mosfet(
            'switch',
            { drain: 'd', gate: 'g', source: 's', body: '' },
            { polarity: 'nmos' },
          ),
        'invalid-circuit',
        'switch.body',
      );
      expectRejected(
        () => new Circuit().mosfet('switch', null as never, { polarity: 'nmos' }),
        'invalid-circuit',
        'switch',
      );
    });
  });

  describe('rejects bad polarity strings', () => {
    it.each([
      ['NPN', 'upper case'],
      ['nmos', 'a MOSFET polarity'],
      ['', 'an empty string'],
    ])('rejects %s (%s) as a bipolar polarity', (polarity) => {
      // docs/devices.md, "Bipolar transistor": model.polarity is 'npn' | 'pnp'
      expectRejected(
        () => new Circuit().bjt('Q9', { collector: 'c', base: 'b', emitter: 'e' }, { polarity } as never),
        'invalid-circuit',
        'Q9.model.polarity',
      );
    });

    it.each([['PMOS'], ['npn'], ['p']])('rejects %s as a MOSFET polarity', (polarity) => {
      // docs/devices.md, "MOSFET": model.polarity is 'nmos' | 'pmos'
      expectRejected(
        () => new Circuit().mosfet('switch', { drain: 'd', gate: 'g', source: 's' }, { polarity } as never),
        'invalid-circuit',
        'switch.model.polarity',
      );
    });

    it('requires a model with a polarity for a transistor', () => {
      // docs/building-circuits.md, "Elements"; docs/devices.md, "Bipolar transistor" and "MOSFET": the model
      // (with its polarity) is required
      expectRejected(
        () => new Circuit().bjt('Q1', { collector: 'c', base: 'b', emitter: 'e' }, undefined as never),
        'invalid-circuit',
        'Q1.model',
      );
      expectRejected(
        () => new Circuit().mosfet('switch', { drain: 'd', gate: 'g', source: 's' }, {} as never),
        'invalid-circuit',
        'switch.model.polarity',
      );
    });
  });

  describe('rejects bad model parameters', () => {
    it.each([
      [
        'a MOSFET gain factor in farads',
        () =>
          new Circuit().mosfet(
            'switch',
            { drain: 'd', gate: 'g', source: GROUND },
            { polarity: 'nmos', gainFactor: '2 mF' },
          ),
        'switch.model.gainFactor',
        'A/V²',
      ],
      [
        'a channel-length modulation in ohms',
        () =>
          new Circuit().mosfet(
            'switch',
            { drain: 'd', gate: 'g', source: GROUND },
            { polarity: 'nmos', channelLengthModulation: '0.02 Ω' },
          ),
        'switch.model.channelLengthModulation',
        '1/V',
      ],
      [
        'a current gain in volts',
        () =>
          new Circuit().bjt(
            'Q1',
            { collector: 'c', base: 'b', emitter: GROUND },
            { polarity: 'npn', forwardBeta: '100 V' },
          ),
        'Q1.model.forwardBeta',
        'none',
      ],
      [
        'a voltage gain in volts',
        () => new Circuit().vcvs('amplifier', ['out', GROUND], ['in', GROUND], '10 V'),
        'amplifier.gain',
        'none',
      ],
    ] as const)('rejects a unit symbol on a quantity without that unit: %s', (_, build, path, unit) => {
      // docs/devices.md, parameter tables: each parameter states its unit; a pure number has none
      const error = expectRejected(build, 'invalid-value', path);
      expect(error.details).toMatchObject({ code: 'invalid-value', unit });
      if (unit !== 'none') expect(error.message).toContain(unit);
      else expect(error.message).toContain('pure number');
    });

    it('accepts an SI prefix on a pure number and on a parameter whose unit has no symbol', () => {
      // BIPM, SI Brochure, 9th ed., 2019, §5.4.7: prefixes apply to the unit one as well (common practice)
      const c = new Circuit()
        .vcvs('amplifier', ['out', GROUND], ['in', GROUND], '10k')
        .mosfet('switch', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos', gainFactor: '2m' });
      expect(c.element('amplifier')).toMatchObject({ gain: 10000 });
      expect(c.element('switch')).toMatchObject({ model: { gainFactor: 0.002 } });
    });

    it('carries the expected range and unit in the details of an out-of-range parameter', () => {
      // common practice, no source: errors as data
      const error = expectRejected(
        () => new Circuit().diode('D1', 'a', 'b', { saturationCurrent: -1 }),
        'invalid-value',
      );
      expect(error.details).toEqual({
        code: 'invalid-value',
        path: ['D1', 'model', 'saturationCurrent'],
        value: -1,
        expected: 'a positive value',
        range: 'positive',
        unit: 'A',
      });
      expect(error.message).toBe('D1.model.saturationCurrent: -1 is not a positive value in A');
    });

    it('rejects a parameter the model does not have with invalid-circuit naming it', () => {
      // docs/devices.md, introduction: the parameter names are fixed
      expectRejected(
        () => new Circuit().diode('D1', 'a', 'b', { saturationcurrent: 1e-14 } as never),
        'invalid-circuit',
        'D1.model.saturationcurrent',
      );
      expectRejected(
        () =>
          new Circuit().bjt('Q1', { collector: 'c', base: 'b', emitter: 'e' }, {
            polarity: 'npn',
            beta: 100,
          } as never),
        'invalid-circuit',
        'Q1.model.beta',
      );
      expectRejected(
        () => new Circuit().opAmp('U1', { plus: 'a', minus: 'b', output: 'c' }, { slewRate: 1e6 } as never),
        'invalid-circuit',
        'U1.options.slewRate',
      );
    });

    it('rejects a model that is not an object', () => {
      // docs/devices.md, introduction: a model is an object of parameters
      expectRejected(() => new Circuit().diode('D1', 'a', 'b', [] as never), 'invalid-circuit', 'D1.model');
      expectRejected(
        () => new Circuit().opAmp('U1', { plus: 'a', minus: 'b', output: 'c' }, 3 as never),
        'invalid-circuit',
        'U1.options',
      );
    });

    it.each([
      [
        'a zero saturation current',
        () => new Circuit().diode('D4', 'a', 'b', { saturationCurrent: 0 }),
        'D4.model.saturationCurrent',
      ],
      [
        'a saturation current in volts',
        () => new Circuit().diode('D4', 'a', 'b', { saturationCurrent: '10 fV' }),
        'D4.model.saturationCurrent',
      ],
      [
        'a negative series resistance',
        () => new Circuit().diode('D4', 'a', 'b', { seriesResistance: -1 }),
        'D4.model.seriesResistance',
      ],
      [
        'a grading coefficient of 1',
        () => new Circuit().diode('D4', 'a', 'b', { gradingCoefficient: 1 }),
        'D4.model.gradingCoefficient',
      ],
      [
        'a boolean transit time',
        () => new Circuit().diode('D4', 'a', 'b', { transitTime: true } as never),
        'D4.model.transitTime',
      ],
      [
        'a negative forward beta',
        () =>
          new Circuit().bjt(
            'Q4',
            { collector: 'c', base: 'b', emitter: 'e' },
            { polarity: 'npn', forwardBeta: -1 },
          ),
        'Q4.model.forwardBeta',
      ],
      [
        'a NaN Early voltage',
        () =>
          new Circuit().bjt(
            'Q4',
            { collector: 'c', base: 'b', emitter: 'e' },
            { polarity: 'pnp', earlyVoltage: Number.NaN },
          ),
        'Q4.model.earlyVoltage',
      ],
      [
        'a negative gain factor',
        () =>
          new Circuit().mosfet(
            'switch',
            { drain: 'd', gate: 'g', source: 's' },
            { polarity: 'nmos', gainFactor: -1e-3 },
          ),
        'switch.model.gainFactor',
      ],
      [
        'a negative gate capacitance',
        () =>
          new Circuit().mosfet(
            'switch',
            { drain: 'd', gate: 'g', source: 's' },
            { polarity: 'pmos', gateSourceCapacitance: '-1p' },
          ),
        'switch.model.gateSourceCapacitance',
      ],
      [
        'a zero open-loop gain',
        () => new Circuit().opAmp('U4', { plus: 'a', minus: 'b', output: 'c' }, { openLoopGain: 0 }),
        'U4.options.openLoopGain',
      ],
      [
        'a negative output resistance',
        () => new Circuit().opAmp('U4', { plus: 'a', minus: 'b', output: 'c' }, { outputResistance: -50 }),
        'U4.options.outputResistance',
      ],
    ])('rejects %s with invalid-value', (_, build, path) => {
      // ranges of the parameter tables of docs/devices.md (I_S > 0, resistances and capacitances ≥ 0, 0 < m < 1);
      // physical meaning: A. S. Sedra and K. C. Smith, Microelectronic Circuits, 7th ed., 2015,
      // ch. 4 and 6 (from memory)
      expectRejected(build, 'invalid-value', path);
    });

    it('accepts Infinity where it removes an effect, and zero for capacitances and transit times', () => {
      // docs/devices.md, introduction and "Diode": zero removes capacitances; Infinity is the default breakdown voltage
      const c = new Circuit()
        .diode('D1', 'a', 'b', {
          breakdownVoltage: Number.POSITIVE_INFINITY,
          junctionCapacitance: 0,
          transitTime: 0,
        })
        .bjt(
          'Q1',
          { collector: 'c', base: 'b', emitter: 'e' },
          { polarity: 'npn', earlyVoltage: Number.POSITIVE_INFINITY },
        )
        .opAmp('U1', { plus: 'a', minus: 'b', output: 'c' }, { gainBandwidth: Number.POSITIVE_INFINITY });
      expect(c.elements).toHaveLength(3);
    });
  });
});

describe('Circuit builder removes and replaces elements', () => {
  /** A 10 V supply behind a 1 kΩ / 1 kΩ divider, loaded by 500 Ω. */
  const loadedDivider = () =>
    new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 10 })
      .resistor('upper', 'in', 'out', '1k')
      .resistor('lower', 'out', GROUND, '1k')
      .resistor('load', 'out', GROUND, 500);

  it('gives the unloaded output impedance of a divider from a copy without its load', () => {
    // Thévenin's theorem (Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed., 2013, §4.5):
    // the divider's output impedance is upper ∥ lower = 500 Ω; with the load also across it, 250 Ω.
    const circuit = loadedDivider();
    const unloaded = circuit.without('load');
    const at1k = { frequencies: [1e3] };
    expect(portImpedance(operatingPoint(unloaded), { plus: 'out' }, at1k)[0]!.re).toBeCloseTo(500, 9);
    expect(portImpedance(operatingPoint(circuit), { plus: 'out' }, at1k)[0]!.re).toBeCloseTo(250, 9);
    expect(circuit.element('load')).toBeDefined();
    expect(unloaded.element('load')).toBeUndefined();
    expect(operatingPoint(unloaded).voltage('out')).toBeCloseTo(5, 12);
  });

  it('removes an element, bumping the revision and dropping nodes only it touched', () => {
    // common practice, no source
    const circuit = loadedDivider().resistor('probe', 'out', 'spare', '1M');
    const revision = circuit.revision;
    circuit.remove('probe');
    expect(circuit.revision).toBeGreaterThan(revision);
    expect(circuit.nodes).not.toContain('spare');
    expect(circuit.elements.map((e) => e.name)).toEqual(['supply', 'upper', 'lower', 'load']);
    // The divider with 500 Ω across its lower leg: 10 · 333.3 / 1333.3 = 2.5 V (Ohm's law).
    expect(operatingPoint(circuit).voltage('out')).toBeCloseTo(2.5, 12);
  });

  it('replaces an element in its place, and a failed replacement leaves the circuit as it was', () => {
    // common practice, no source
    const circuit = loadedDivider();
    const revision = circuit.revision;
    circuit.replace('load', (c) => c.resistor('load', 'out', GROUND, '1k'));
    expect(circuit.revision).toBeGreaterThan(revision);
    expect(circuit.elements.map((e) => e.name)).toEqual(['supply', 'upper', 'lower', 'load']);
    // 1 kΩ ∥ 1 kΩ = 500 Ω below 1 kΩ: 10 · 500 / 1500 V.
    expect(operatingPoint(circuit).voltage('out')).toBeCloseTo(10 / 3, 12);
    const before = circuit.toJSON();
    expectRejected(
      () => circuit.replace('load', (c) => c.resistor('load', 'out', GROUND, -1)),
      'invalid-value',
      'load.resistance',
    );
    expectRejected(
      () => circuit.replace('load', (c) => c.resistor('upper', 'out', GROUND, 1)),
      'duplicate-name',
      'upper',
    );
    expect(circuit.toJSON()).toEqual(before);
  });

  it('rejects a name the circuit does not have', () => {
    // common practice, no source
    expectRejected(() => loadedDivider().remove('sense'), 'unknown-element', 'sense');
    expectRejected(() => loadedDivider().replace('sense', () => undefined), 'unknown-element', 'sense');
    expectRejected(() => loadedDivider().without('load', 'sense'), 'unknown-element', 'sense');
  });
});

describe('Circuit builder shares a model given once', () => {
  // Common practice, no source: elements built from one model object need one parsed model, which
  // keeps a circuit of many like transistors small; a model object changed between two elements
  // must still give each element the values it had when that element was added.
  const model: BjtModel = { polarity: 'npn', forwardBeta: 120, earlyVoltage: 75 };

  it('gives the elements built from one model object one parsed model', () => {
    const c = new Circuit()
      .bjt('left', { collector: 'a', base: 'b', emitter: GROUND }, model)
      .bjt('right', { collector: 'c', base: 'b', emitter: GROUND }, model)
      .diode('clampA', 'a', GROUND)
      .diode('clampB', 'c', GROUND, {});
    const record = (name: string) => c.element(name) as { model: object };
    expect(record('left').model).toBe(record('right').model);
    expect(record('left').model).toEqual({ forwardBeta: 120, earlyVoltage: 75 });
    expect(record('clampA').model).toBe(record('clampB').model);
    expect(Object.isFrozen(record('left').model)).toBe(true);
  });

  it('gives elements equal models written apart one parsed model, and unequal ones their own', () => {
    const c = new Circuit()
      .diode('first', 'a', GROUND, { junctionCapacitance: '2p', saturationCurrent: 1e-14 })
      .diode('second', 'b', GROUND, { junctionCapacitance: 2e-12, saturationCurrent: '10f' })
      .diode('third', 'c', GROUND, { junctionCapacitance: '3p', saturationCurrent: 1e-14 });
    const model = (name: string) => (c.element(name) as { model: object }).model;
    expect(model('first')).toBe(model('second'));
    expect(model('third')).not.toBe(model('first'));
    expect(model('third')).toEqual({ junctionCapacitance: 3e-12, saturationCurrent: 1e-14 });
  });

  it('reads a model object afresh once its values changed', () => {
    const changing = { ...model };
    const c = new Circuit().bjt('first', { collector: 'a', base: 'b', emitter: GROUND }, changing);
    changing.forwardBeta = 250;
    c.bjt('second', { collector: 'c', base: 'b', emitter: GROUND }, changing);
    delete (changing as { earlyVoltage?: number }).earlyVoltage;
    c.bjt('third', { collector: 'd', base: 'b', emitter: GROUND }, changing);
    expect((c.element('first') as { model: object }).model).toEqual({ forwardBeta: 120, earlyVoltage: 75 });
    expect((c.element('second') as { model: object }).model).toEqual({ forwardBeta: 250, earlyVoltage: 75 });
    expect((c.element('third') as { model: object }).model).toEqual({ forwardBeta: 250 });
  });

  it('still refuses a bad value in a model object it has read before', () => {
    const reused = { ...model };
    const c = new Circuit().bjt('good', { collector: 'a', base: 'b', emitter: GROUND }, reused);
    reused.forwardBeta = -3;
    expect(() => c.bjt('bad', { collector: 'c', base: 'b', emitter: GROUND }, reused)).toThrow(
      QuiescentError,
    );
  });
});
