import { describe, expect, it } from 'vitest';
import {
  Circuit,
  DOCUMENT_FORMAT,
  DOCUMENT_VERSION,
  type ErrorCode,
  GROUND,
  operatingPoint,
  QuiescentError,
} from '../../src/index.js';

/**
 * The JSON form of a circuit: a document that survives `JSON.stringify`/`JSON.parse` (ECMA-404, The
 * JSON Data Interchange Syntax, 2nd ed., 2017), is validated field by field, and never lets a key
 * such as `__proto__` reach an object's prototype (ECMA-262, 2023, §10.4.7 and §B.3.1, the
 * `__proto__` property; prototype pollution as described by O. Arteau, "Prototype pollution attack
 * in NodeJS application", NorthSec 2018).
 */

/** A circuit using every kind of element, with a DC solution (each part is biased by a source). */
function everyKind(): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 5, ac: { magnitude: '10m', phase: 30 } })
    .resistor('Rb', 'vcc', 'b', '430k')
    .resistor('Rc', 'vcc', 'c', '2.2k')
    .bjt(
      'Q1',
      { collector: 'c', base: 'b', emitter: GROUND },
      { polarity: 'npn', forwardBeta: 120, earlyVoltage: 80 },
    )
    .capacitor('Cout', 'c', 'out', '1uF')
    .resistor('Rout', 'out', GROUND, '10k')
    .inductor('L1', 'vcc', 'l', '1m')
    .resistor('Rl', 'l', GROUND, '1k')
    .currentSource('bias', GROUND, 'i', { dc: '1m', ac: 0.5 })
    .resistor('Ri', 'i', GROUND, '1k')
    .vcvs('buffer', ['e', GROUND], ['i', GROUND], 2)
    .resistor('Re', 'e', GROUND, '1k')
    .vccs('transconductor', [GROUND, 'g'], ['i', GROUND], '1m')
    .resistor('Rg', 'g', GROUND, '1k')
    .ccvs('senseAmp', ['h', GROUND], 'supply', 100)
    .loopProbe('sense', 'h', 'hs')
    .resistor('Rh', 'hs', GROUND, '1k')
    .cccs('mirror', [GROUND, 'f'], 'L1', 2)
    .resistor('Rf', 'f', GROUND, '1k')
    .opAmp('U1', { plus: 'i', minus: 'u1', output: 'u1' })
    .opAmp(
      'U2',
      { plus: 'i', minus: 'u2', output: 'u2' },
      { openLoopGain: 1e4, gainBandwidth: '1M', outputResistance: 50 },
    )
    .resistor('Ru2', 'u2', GROUND, '10k')
    .diode('D1', 'vcc', 'd', { saturationCurrent: '2n', emissionCoefficient: 1.9, breakdownVoltage: 100 })
    .resistor('Rd', 'd', GROUND, '1k')
    .mosfet('switch', { drain: 'md', gate: 'i', source: GROUND }, { polarity: 'nmos', thresholdVoltage: 0.5 })
    .resistor('Rmd', 'vcc', 'md', '10k')
    .mosfet(
      'pullUp',
      { drain: 'pd', gate: GROUND, source: 'vcc', body: 'vcc' },
      { polarity: 'pmos', gainFactor: '2m' },
    )
    .resistor('Rpd', 'pd', GROUND, '10k');
}

/** Every node voltage and every two-terminal or output-branch current of a solution, by name. */
function solution(c: Circuit): Record<string, number> {
  const op = operatingPoint(c);
  const out: Record<string, number> = {};
  for (const node of c.nodes) out[`v(${node})`] = op.voltage(node);
  for (const e of c.elements) {
    if (e.kind === 'bjt') out[`ic(${e.name})`] = op.bjt(e.name).ic;
    else if (e.kind === 'mosfet') out[`id(${e.name})`] = op.mosfet(e.name).id;
    else out[`i(${e.name})`] = op.current(e.name);
  }
  return out;
}

/** JSON text and back, as a file or a network message would carry the document. */
function throughText(c: Circuit): unknown {
  return JSON.parse(JSON.stringify(c.toJSON()));
}

/** A valid document of a divider, as plain mutable data, for breaking one field at a time. */
function dividerDocument(): { format: unknown; version: unknown; elements: Record<string, unknown>[] } {
  return JSON.parse(
    JSON.stringify(
      new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 10 })
        .resistor('R1', 'in', 'out', '1k')
        .capacitor('C1', 'out', GROUND, '1n')
        .resistor('R2', 'out', GROUND, '3k')
        .toJSON(),
    ),
  );
}

/** The QuiescentError that `Circuit.fromJSON(doc)` throws, with its code and message checked. */
function expectRejected(doc: unknown, code: ErrorCode, ...inMessage: string[]): QuiescentError {
  let error: unknown;
  try {
    Circuit.fromJSON(doc);
  } catch (e) {
    error = e;
  }
  expect(error).toBeInstanceOf(QuiescentError);
  const q = error as QuiescentError;
  expect(q.code, q.message).toBe(code);
  for (const text of inMessage) expect(q.message).toContain(text);
  return q;
}

describe('Circuit JSON documents', () => {
  describe('round trip', () => {
    it('gives the same document after toJSON, stringify, parse and fromJSON, for every kind of element', () => {
      // ECMA-404, 2017: JSON text carries strings, finite numbers, objects and arrays unchanged
      const original = everyKind();
      const kinds = new Set(original.elements.map((e) => e.kind));
      expect(kinds.size).toBe(14);
      const rebuilt = Circuit.fromJSON(throughText(original));
      expect(rebuilt.toJSON()).toEqual(original.toJSON());
      expect(rebuilt.elements).toEqual(original.elements);
    });

    it('writes the format name and version, with numbers in SI units', () => {
      // common practice, no source: a versioned document; SI Brochure, 9th ed., 2019, Table 7 (k, u)
      const doc = new Circuit().resistor('R1', 'a', GROUND, '4.7k').toJSON();
      expect(doc.format).toBe(DOCUMENT_FORMAT);
      expect(doc.version).toBe(DOCUMENT_VERSION);
      expect(doc.elements[0]).toEqual({ kind: 'resistor', name: 'R1', a: 'a', b: GROUND, resistance: 4700 });
    });

    it('leaves out Infinity, which JSON cannot carry, and reads the default back in its place', () => {
      // ECMA-404, 2017, §8: a JSON number is finite
      const c = new Circuit()
        .diode('D1', 'a', GROUND, { breakdownVoltage: Number.POSITIVE_INFINITY, saturationCurrent: 1e-12 })
        .resistor('R1', 'a', GROUND, 1);
      const text = JSON.stringify(c.toJSON());
      expect(text).not.toContain('null');
      expect(text).not.toContain('breakdownVoltage');
      expect(Circuit.fromJSON(JSON.parse(text)).toJSON()).toEqual(c.toJSON());
    });

    it('gives the same operating point after the round trip', () => {
      // the same equations give the same solution (common practice, no source)
      const original = everyKind();
      const before = solution(original);
      const after = solution(Circuit.fromJSON(throughText(original)));
      expect(Object.keys(after)).toEqual(Object.keys(before));
      for (const [key, value] of Object.entries(before)) {
        expect(Number.isFinite(value), key).toBe(true);
        expect(after[key], key).toBe(value);
      }
    });

    it('hands out a document detached from the circuit', () => {
      // common practice, no source: editing an export does not edit the source
      const c = new Circuit()
        .voltageSource('supply', 'a', GROUND, { dc: 1, ac: 1 })
        .resistor('R1', 'a', GROUND, 1);
      const doc = c.toJSON() as unknown as { elements: { ac: { magnitude: number } }[] };
      doc.elements[0]!.ac.magnitude = 99;
      expect(c.element('supply')).toMatchObject({ ac: { magnitude: 1 } });
    });
  });

  describe('rejects bad documents with invalid-circuit or invalid-value naming the path', () => {
    it('names the path of a mistyped field', () => {
      // common practice, no source: validation reports where the fault is
      const doc = dividerDocument();
      doc.elements[3]!.resistance = '3k';
      const error = expectRejected(doc, 'invalid-circuit', 'elements[3].resistance');
      expect(error.details).toMatchObject({ code: 'invalid-circuit', path: ['elements', 3, 'resistance'] });
    });

    it('names the path of a missing field', () => {
      // common practice, no source
      const doc = dividerDocument();
      delete doc.elements[1]!.b;
      expectRejected(doc, 'invalid-circuit', 'elements[1].b');
    });

    it('names the path and the element of an out-of-range value', () => {
      // Alexander & Sadiku, Fundamentals of Electric Circuits, 5th ed., 2013, §2.2 (from memory): R > 0
      const doc = dividerDocument();
      doc.elements[3]!.resistance = -3000;
      const error = expectRejected(doc, 'invalid-value', 'elements[3].resistance', 'R2');
      expect(error.details).toMatchObject({ path: ['elements', 3, 'resistance'] });
    });

    it('rejects an unknown kind, naming it and its path', () => {
      // common practice, no source
      const doc = dividerDocument();
      doc.elements[2]!.kind = 'memristor';
      expectRejected(doc, 'invalid-circuit', 'elements[2].kind', 'memristor');
    });

    it.each([['constructor'], ['__proto__'], ['toString'], ['hasOwnProperty']])(
      'rejects %s as a kind, though it is a key every object inherits',
      (kind) => {
        // ECMA-262, 2023, §20.1.3 (Object.prototype's properties)
        const doc = dividerDocument();
        doc.elements[1]!.kind = kind;
        expectRejected(doc, 'invalid-circuit', 'elements[1].kind');
      },
    );

    it('rejects a field the kind does not have', () => {
      // common practice, no source: strict validation finds misspelt fields
      const doc = dividerDocument();
      doc.elements[1]!.resistence = 10;
      expectRejected(doc, 'invalid-circuit', 'elements[1].resistence');
    });

    it('rejects a name that is not a non-empty string', () => {
      // docs/building-circuits.md, "Elements": element names are non-empty strings
      const doc = dividerDocument();
      doc.elements[1]!.name = 5;
      expectRejected(doc, 'invalid-circuit', 'elements[1].name');
      const empty = dividerDocument();
      empty.elements[2]!.name = '';
      const error = expectRejected(empty, 'invalid-circuit', 'elements[2].name');
      expect(error.details).toMatchObject({ code: 'invalid-circuit', path: ['elements', 2, 'name'] });
    });

    it('rejects an element that is not an object, and elements that are not an array', () => {
      // common practice, no source
      const doc = dividerDocument() as { elements: unknown[] };
      doc.elements[0] = 'supply in gnd 10';
      expectRejected(doc, 'invalid-circuit', 'elements[0]');
      expectRejected({ ...dividerDocument(), elements: {} }, 'invalid-circuit', 'elements');
    });

    it.each([
      ['a string', 'hello'],
      ['null', null],
      ['an array', []],
      ['a number', 1],
    ])('rejects %s as a document', (_, doc) => {
      // common practice, no source
      expectRejected(doc, 'invalid-circuit', 'object');
    });

    it('rejects a wrong format name or an unsupported version', () => {
      // common practice, no source: a versioned format refuses what it does not know
      expectRejected({ ...dividerDocument(), format: 'schematic' }, 'invalid-circuit', 'format');
      expectRejected({ ...dividerDocument(), version: DOCUMENT_VERSION + 1 }, 'invalid-circuit', 'version');
      expectRejected({ ...dividerDocument(), version: '1' }, 'invalid-circuit', 'version');
      const { format: _, ...noFormat } = dividerDocument();
      expectRejected(noFormat, 'invalid-circuit', 'format');
    });

    it('rejects a field the document does not have', () => {
      // common practice, no source
      expectRejected({ ...dividerDocument(), author: 'me' }, 'invalid-circuit', 'author');
    });

    it('names the path of a bad AC setting', () => {
      // docs/building-circuits.md, "Sources and their AC excitation": ac is a magnitude or { magnitude, phase }
      const doc = dividerDocument();
      doc.elements[0]!.ac = 'big';
      expectRejected(doc, 'invalid-circuit', 'elements[0].ac');
      doc.elements[0]!.ac = { magnitude: 1, phase: '90' };
      expectRejected(doc, 'invalid-value', 'elements[0].ac.phase');
    });

    it('prints the path once, in the document, with the element it belongs to', () => {
      // common practice, no source: one fault, one place named
      const doc = dividerDocument();
      doc.elements[3]!.resistance = -5;
      const error = expectRejected(doc, 'invalid-value', 'elements[3].resistance');
      expect(error.message).toBe("elements[3].resistance ('R2'): -5 is not a positive value in Ω");
      expect(error.details).toMatchObject({ element: 'R2', range: 'positive', unit: 'Ω', value: -5 });
    });

    it("names a controlled source's document field, not the builder's argument", () => {
      // common practice, no source: the path points into the document the user wrote
      const doc = {
        format: DOCUMENT_FORMAT,
        version: DOCUMENT_VERSION,
        elements: [
          { kind: 'voltage-source', name: 'drive', plus: 'in', minus: GROUND, dc: 1 },
          {
            kind: 'vcvs',
            name: 'buffer',
            outPlus: 'out',
            outMinus: GROUND,
            controlPlus: '',
            controlMinus: GROUND,
            gain: 2,
          },
        ],
      };
      const error = expectRejected(doc, 'invalid-circuit', 'elements[1].controlPlus');
      expect(error.details).toMatchObject({ path: ['elements', 1, 'controlPlus'] });
      expect(error.message).not.toContain('control[0]');
    });

    it('reports a bad polarity at the element field where the document keeps it', () => {
      // docs/devices.md, "Bipolar transistor": polarity 'npn' | 'pnp'; common practice, no source: the path points into the document
      const doc = {
        format: DOCUMENT_FORMAT,
        version: DOCUMENT_VERSION,
        elements: [{ kind: 'bjt', name: 'Q1', collector: 'c', base: 'b', emitter: GROUND, polarity: 'NPN' }],
      };
      const error = expectRejected(doc, 'invalid-circuit', 'elements[0].polarity', 'Q1');
      expect(error.details).toMatchObject({ code: 'invalid-circuit', path: ['elements', 0, 'polarity'] });
      // The details say what the message says: which values are allowed and what was given.
      expect(error.details).toMatchObject({
        element: 'Q1',
        problem: { kind: 'not-one-of', what: 'polarity', allowed: ['npn', 'pnp'], got: '"NPN"' },
      });
    });

    it('rejects a polarity inside the model, which would contradict the element field', () => {
      // common practice, no source: one fact, one place
      const doc = {
        format: DOCUMENT_FORMAT,
        version: DOCUMENT_VERSION,
        elements: [
          {
            kind: 'mosfet',
            name: 'switch',
            drain: 'd',
            gate: 'g',
            source: GROUND,
            polarity: 'nmos',
            model: { polarity: 'pmos' },
          },
        ],
      };
      expectRejected(doc, 'invalid-circuit', 'elements[0].model.polarity', 'switch');
    });

    it('names the path of a bad model parameter', () => {
      // docs/devices.md, "Diode": saturationCurrent > 0
      const doc = {
        format: DOCUMENT_FORMAT,
        version: DOCUMENT_VERSION,
        elements: [
          { kind: 'resistor', name: 'R1', a: 'a', b: GROUND, resistance: 1 },
          { kind: 'diode', name: 'D1', anode: 'a', cathode: GROUND, model: { saturationCurrent: -1 } },
        ],
      };
      expectRejected(doc, 'invalid-value', 'elements[1].model.saturationCurrent', 'D1');
    });

    it('rejects a duplicate name with duplicate-name', () => {
      // docs/building-circuits.md, "Elements": element names are unique
      const doc = dividerDocument();
      doc.elements[3]!.name = 'R1';
      expectRejected(doc, 'duplicate-name', 'R1');
    });
  });

  describe('prototype keys', () => {
    const polluted = () => (({}) as Record<string, unknown>).injected;

    it('rejects __proto__ and constructor keys in a parsed document and leaves Object.prototype alone', () => {
      // Arteau, "Prototype pollution attack in NodeJS application", 2018: JSON.parse makes an own
      // "__proto__" key that a naive merge would follow
      const texts = [
        '{"format":"quiescent-circuit","version":1,"elements":[],"__proto__":{"injected":1}}',
        '{"format":"quiescent-circuit","version":1,"elements":[{"kind":"resistor","name":"R1","a":"a","b":"gnd","resistance":1,"__proto__":{"injected":1}}]}',
        '{"format":"quiescent-circuit","version":1,"elements":[{"kind":"diode","name":"D1","anode":"a","cathode":"gnd","model":{"__proto__":{"injected":1}}}]}',
        '{"format":"quiescent-circuit","version":1,"elements":[{"kind":"bjt","name":"Q1","collector":"c","base":"b","emitter":"gnd","polarity":"npn","model":{"constructor":{"prototype":{"injected":1}}}}]}',
        '{"format":"quiescent-circuit","version":1,"elements":[{"kind":"op-amp","name":"U1","plus":"a","minus":"o","output":"o","options":{"__proto__":{"injected":1}}}]}',
        '{"format":"quiescent-circuit","version":1,"elements":[{"kind":"voltage-source","name":"supply","plus":"a","minus":"gnd","ac":{"magnitude":1,"__proto__":{"injected":1}}}]}',
        '{"format":"quiescent-circuit","version":1,"elements":[{"kind":"resistor","name":"R1","a":"a","b":"gnd","resistance":1,"constructor":{"injected":1}}]}',
      ];
      for (const text of texts) {
        const doc = JSON.parse(text);
        const error = expectRejected(doc, 'invalid-circuit');
        expect(error.message).toMatch(/__proto__|constructor/);
        expect(polluted()).toBeUndefined();
      }
    });

    it('reads only own fields, not ones a document inherits', () => {
      // ECMA-262, 2023, §20.1.2.13 (Object.hasOwn): inherited properties are not the document's
      const element = Object.create({ resistance: 5 }) as Record<string, unknown>;
      Object.assign(element, { kind: 'resistor', name: 'R1', a: 'a', b: GROUND });
      const doc = { format: DOCUMENT_FORMAT, version: DOCUMENT_VERSION, elements: [element] };
      expectRejected(doc, 'invalid-circuit', 'elements[0].resistance');
    });

    it('accepts __proto__ and constructor as ordinary node and element names', () => {
      // ECMA-262, 2023, §24.1 (Map): names kept in a Map have no special meaning; Ohm's law, V = I·R
      const text =
        '{"format":"quiescent-circuit","version":1,"elements":[' +
        '{"kind":"resistor","name":"__proto__","a":"__proto__","b":"gnd","resistance":2000},' +
        '{"kind":"current-source","name":"constructor","from":"gnd","to":"__proto__","dc":0.001}]}';
      const c = Circuit.fromJSON(JSON.parse(text));
      const op = operatingPoint(c);
      expect(op.voltage('__proto__')).toBeCloseTo(2, 12);
      expect(op.current('__proto__')).toBeCloseTo(1e-3, 15);
      expect(op.current('constructor')).toBe(1e-3);
      expect(polluted()).toBeUndefined();
    });
  });
});
