/**
 * Circuit.fromJSON on documents mutated at random (fields replaced, removed, renamed to
 * prototype-polluting keys) throws nothing but a QuiescentError with a listed code, and never
 * changes Object's prototype.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, QuiescentError } from '../../src/index.js';

const CODES = new Set([
  'invalid-value',
  'duplicate-name',
  'unknown-node',
  'unknown-element',
  'no-ground',
  'floating-node',
  'singular',
  'no-convergence',
  'invalid-circuit',
]);

const base = new Circuit()
  .voltageSource('supply', 'vcc', GROUND, { dc: 12, ac: { magnitude: 1, phase: 30 } })
  .resistor('load', 'vcc', 'c', '2.2k')
  .capacitor('bypass', 'e', GROUND, '10u')
  .bjt('Q1', { collector: 'c', base: 'b', emitter: 'e' }, { polarity: 'npn', forwardBeta: 150 })
  .diode('clamp', 'b', GROUND, { saturationCurrent: 1e-14 })
  .vcvs('copy', ['x', GROUND], ['c', GROUND], 2)
  .resistor('copyLoad', 'x', GROUND, '1k')
  .opAmp('U1', { plus: 'x', minus: 'y', output: 'y' }, { openLoopGain: 1e5 })
  .toJSON();

/** Every path to a value inside a JSON value. */
function paths(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [prefix];
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) out.push(...paths(value[i], [...prefix, i]));
  } else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) out.push(...paths(v, [...prefix, k]));
  }
  return out;
}

const allPaths = paths(base).filter((p) => p.length > 0);
const replacement = fc.oneof(
  fc.jsonValue({ maxDepth: 2 }),
  fc.constantFrom(-1, 0, 5e-324, 1e308, -1e-300, '1e999', 'NaN', '10 F', '', '__proto__', null, [], {}),
);
const mutation = fc.record({
  path: fc.constantFrom(...allPaths),
  kind: fc.constantFrom('replace', 'delete', 'pollute'),
  value: replacement,
});

function mutate(document: unknown, m: { path: (string | number)[]; kind: string; value: unknown }): unknown {
  const copy = JSON.parse(JSON.stringify(document));
  let parent: Record<string | number, unknown> = copy;
  for (const key of m.path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
  const last = m.path[m.path.length - 1]!;
  if (m.kind === 'delete') delete parent[last];
  else if (m.kind === 'replace') parent[last] = m.value;
  else {
    // JSON.parse makes '__proto__' an own key, as a parsed document from outside would have.
    const polluted = JSON.parse(
      `{"__proto__": {"polluted": true}, "constructor": {"prototype": {"polluted": true}}}`,
    );
    parent[last] =
      typeof parent[last] === 'object' && parent[last] !== null
        ? { ...(parent[last] as object), ...polluted }
        : polluted;
  }
  return copy;
}

describe('Circuit.fromJSON on mutated documents', () => {
  it('reads the document unmutated', () => {
    expect(Circuit.fromJSON(base).elements.length).toBe(8);
  });

  it('throws only QuiescentError with a listed code, and never pollutes a prototype', () => {
    fc.assert(
      fc.property(fc.array(mutation, { minLength: 1, maxLength: 3 }), (mutations) => {
        let document: unknown = base;
        for (const m of mutations) {
          try {
            document = mutate(document, m);
          } catch {
            // A path removed by an earlier mutation: keep the document as it is.
          }
        }
        try {
          Circuit.fromJSON(document);
        } catch (e) {
          if (!(e instanceof QuiescentError)) throw e;
          expect(CODES.has(e.code)).toBe(true);
        }
        expect(({} as Record<string, unknown>).polluted).toBeUndefined();
        expect(Object.hasOwn(Object.prototype, 'polluted')).toBe(false);
      }),
      { seed: 5, numRuns: 3000 },
    );
  });
});
