/**
 * Cautions about a solved operating point (docs/cautions.md): data plus words for answers that
 * satisfy the equations but that a careful engineer would question.
 */
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint, QuiescentError, REVERSE_BREAKDOWN_LIMIT } from '../../src/index.js';

describe('operating-point cautions', () => {
  it('flag a current forced backwards into a diode, whose model then shows about −1e9 V', () => {
    // 1 mA through the 1e-12 S junction conductance: −1e9 V (Ohm's law on the model's conductance).
    const circuit = new Circuit().currentSource('force', 'k', GROUND, { dc: 1e-3 }).diode('D1', 'k', GROUND);
    const op = operatingPoint(circuit);
    expect(op.voltage('k')).toBeLessThan(-REVERSE_BREAKDOWN_LIMIT);
    const caution = op.cautions.find((c) => c.code === 'reverse-beyond-breakdown');
    expect(caution?.element).toBe('D1');
    expect(caution?.value).toBeCloseTo(1e9, -3);
    expect(op.warnings.some((w) => w.includes("'D1'") && w.includes('breakdown'))).toBe(true);
  });

  it('are empty for a diode at a milliamp', () => {
    const circuit = new Circuit()
      .voltageSource('supply', 'a', GROUND, { dc: 5 })
      .resistor('limit', 'a', 'k', '4.3k')
      .diode('D1', 'k', GROUND);
    expect(operatingPoint(circuit).cautions).toEqual([]);
  });

  it('flag a node with a single connection and suggest the name it was probably meant to be', () => {
    // 'mdi' is a typo of 'mid': the divider's lower half hangs from a node of its own.
    const circuit = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 5 })
      .resistor('upper', 'in', 'mid', '1k')
      .resistor('lower', 'mdi', GROUND, '1k')
      .resistor('sense', 'mid', GROUND, '1M');
    const op = operatingPoint(circuit);
    const caution = op.cautions.find((c) => c.code === 'single-connection');
    expect(caution).toMatchObject({ code: 'single-connection', node: 'mdi', element: 'lower' });
    expect(caution?.message).toContain("did you mean 'mid'?");
  });

  it('flag an ideal op-amp in positive feedback, and not one in negative feedback', () => {
    const build = (plus: string, minus: string) =>
      new Circuit()
        .voltageSource('supply', 'in', GROUND, { dc: 1 })
        .resistor('input', 'in', 'sum', '1k')
        .resistor('feedback', 'sum', 'out', '2k')
        .opAmp('U1', { plus, minus, output: 'out' })
        .resistor('load', 'out', GROUND, '1k');
    const positive = operatingPoint(build('sum', GROUND)).cautions;
    // The divider returns 1k/(1k + 2k) = 1/3 of the output to the non-inverting input (voltage divider).
    expect(positive).toHaveLength(1);
    expect(positive[0]).toMatchObject({ code: 'positive-feedback', element: 'U1' });
    expect(positive[0]!.value).toBeCloseTo(1 / 3, 12);
    expect(operatingPoint(build(GROUND, 'sum')).cautions).toEqual([]);
  });

  it('flag a finite-gain op-amp whose inputs are far apart', () => {
    const circuit = new Circuit()
      .voltageSource('supply', 'in', GROUND, { dc: 1 })
      .opAmp('U1', { plus: 'in', minus: GROUND, output: 'out' }, { openLoopGain: 1e5 })
      .resistor('load', 'out', GROUND, '1k');
    const op = operatingPoint(circuit);
    expect(op.cautions.map((c) => c.code)).toEqual(['amplifier-inputs-apart']);
    expect(op.cautions[0]!.value).toBe(1);
  });

  it('are plain frozen data that JSON can carry', () => {
    const op = operatingPoint(
      new Circuit().currentSource('force', 'k', GROUND, { dc: 1 }).diode('D1', GROUND, 'k'),
    );
    expect(Object.isFrozen(op.cautions)).toBe(true);
    expect(JSON.parse(JSON.stringify(op.cautions))).toEqual(op.cautions);
  });
});

describe('no-ground', () => {
  it("suggests 'gnd' for a node named like a ground", () => {
    for (const name of ['0', 'GND', 'ground']) {
      const circuit = new Circuit()
        .voltageSource('supply', 'a', name, { dc: 1 })
        .resistor('load', 'a', name, '1k');
      let error: unknown;
      try {
        operatingPoint(circuit);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(QuiescentError);
      const e = error as QuiescentError;
      expect(e.code).toBe('no-ground');
      expect(e.details).toEqual({ code: 'no-ground', groundLikeNodes: [name] });
      expect(e.message).toContain(`'${name}' looks meant as ground`);
    }
  });
});
