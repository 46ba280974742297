/**
 * The resistor's optional fifth argument, `{ noiseless }` (docs/noise.md, "Generators"): checked
 * like every builder argument, and kept through the JSON form of the circuit.
 */
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND } from '../../src/index.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

describe('Circuit.resistor options', () => {
  it('records a noiseless resistor and keeps it through JSON', () => {
    const c = new Circuit()
      .resistor('sense', 'a', GROUND, '1k', { noiseless: true })
      .resistor('plain', 'a', GROUND, '1k', { noiseless: false })
      .resistor('bare', 'a', GROUND, '1k');
    const json = JSON.parse(JSON.stringify(c.toJSON()));
    expect(json.elements.map((e: { noiseless?: boolean }) => e.noiseless)).toEqual([
      true,
      undefined,
      undefined,
    ]);
    const back = Circuit.fromJSON(json);
    expect(back.toJSON()).toEqual(c.toJSON());
  });

  it('refuses options that are not { noiseless: boolean }', () => {
    expectQuiescentError(
      () => new Circuit().resistor('R1', 'a', GROUND, 1, { noiseless: 'yes' } as never),
      'invalid-circuit',
      'noiseless',
    );
    expectQuiescentError(
      () => new Circuit().resistor('R1', 'a', GROUND, 1, { quiet: true } as never),
      'invalid-circuit',
      'quiet',
    );
    expectQuiescentError(
      () => new Circuit().resistor('R1', 'a', GROUND, 1, null as never),
      'invalid-circuit',
      'options',
    );
  });

  it('refuses a document whose noiseless field is not a boolean', () => {
    const document = {
      format: 'quiescent-circuit',
      version: 1,
      elements: [{ kind: 'resistor', name: 'R1', a: 'a', b: GROUND, resistance: 1, noiseless: 1 }],
    };
    expectQuiescentError(() => Circuit.fromJSON(document), 'invalid-circuit', 'noiseless');
  });
});
