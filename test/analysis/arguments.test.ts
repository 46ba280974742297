/**
 * Every public entry point checks what it was given and throws a QuiescentError naming the argument
 * (docs/analyses.md, "Arguments"), never a TypeError or a wrong number.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import * as library from '../../src/index.js';
import {
  acAnalysis,
  Circuit,
  dcSweep,
  formatOperatingPoint,
  GROUND,
  linearity,
  operatingPoint,
  QuiescentError,
} from '../../src/index.js';
import { thrown } from '../support/quiescent-error.js';

const circuit = new Circuit()
  .voltageSource('supply', 'in', GROUND, { dc: 1, ac: 1 })
  .resistor('R1', 'in', 'out', '1k')
  .diode('D1', 'out', GROUND);
const op = operatingPoint(circuit);
const ac = acAnalysis(op, { frequencies: [1e3] });

describe('public entry points given the wrong arguments', () => {
  it('name the argument in invalid-value or invalid-circuit', () => {
    const cases: [() => unknown, string, string][] = [
      [() => operatingPoint(circuit, null as never), 'invalid-value', 'options'],
      [() => formatOperatingPoint(op, null as never), 'invalid-value', 'options'],
      [() => acAnalysis(circuit as never, { frequencies: [1] }), 'invalid-value', 'op'],
      [() => acAnalysis(null as never, { frequencies: [1] }), 'invalid-value', 'op'],
      [() => linearity(op as never), 'invalid-value', 'ac'],
      [() => operatingPoint({} as never), 'invalid-circuit', 'circuit'],
      [() => dcSweep(null as never, { source: 'supply', values: [1] }), 'invalid-circuit', 'circuit'],
    ];
    for (const [run, code, argument] of cases) {
      const e = thrown(run);
      expect(e.code).toBe(code);
      expect(e.details).toMatchObject({ path: [argument] });
      expect(e.message.startsWith(`${argument}: expected`)).toBe(true);
    }
  });

  it('reject a parsed document handed to operatingPoint instead of read through Circuit.fromJSON', () => {
    // A saturation current of −1 would give −6.3e36 A if the document were solved unchecked.
    const document = JSON.parse(JSON.stringify(circuit.toJSON()));
    const e = thrown(() => operatingPoint(document));
    expect(e.code).toBe('invalid-circuit');
    expect(e.message).toContain('Circuit.fromJSON');
  });

  it('throw only QuiescentError for any wrong first argument of any public function', async () => {
    const wrong = fc.oneof(
      fc.constantFrom(null, undefined, 0, Number.NaN, '', 'gnd', true, [], {}, circuit, op, ac, () => 0),
      fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }),
      fc.array(fc.jsonValue({ maxDepth: 1 }), { maxLength: 3 }),
    );
    const pending: Promise<[string, unknown] | undefined>[] = [];
    const functions = Object.entries(library).filter(
      ([name, value]) => typeof value === 'function' && /^[a-z]/.test(name),
    ) as [string, (...args: unknown[]) => unknown][];
    fc.assert(
      fc.property(fc.constantFrom(...functions), wrong, wrong, ([name, fn], first, second) => {
        try {
          const result = fn(first, second);
          // An asynchronous entry point (monteCarlo) rejects instead of throwing: checked below.
          if (result instanceof Promise)
            pending.push(
              result.then(
                () => undefined,
                (e) => [name, e],
              ),
            );
        } catch (e) {
          if (!(e instanceof QuiescentError)) throw new Error(`${name}: ${String(e)}`);
        }
      }),
      { seed: 17, numRuns: 3000 },
    );
    for (const rejection of await Promise.all(pending)) {
      if (rejection !== undefined && !(rejection[1] instanceof QuiescentError)) {
        throw new Error(`${rejection[0]}: ${String(rejection[1])}`);
      }
    }
  });
});
