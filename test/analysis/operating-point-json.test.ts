import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint, operatingPointToJson } from '../../src/index.js';

describe('OperatingPoint.toJSON', () => {
  // A 1 mA current source into 2.2 kΩ gives 2.2 V (Ohm's law; common practice, no source), and a diode
  // fed by 1 mA from a 5 V rail: its current is the rail minus its voltage over the resistor (KCL).
  const circuit = new Circuit()
    .currentSource('reference', GROUND, 'ref', { dc: '1m' })
    .resistor('Rref', 'ref', GROUND, '2.2k')
    .voltageSource('supply', 'rail', GROUND, { dc: 5 })
    .resistor('Rfeed', 'rail', 'anode', '4.3k')
    .diode('D1', 'anode', GROUND);
  const op = operatingPoint(circuit);

  it('holds node voltages, element currents and device reports as plain numbers', () => {
    const data = op.toJSON();
    expect(data.nodes['ref']).toBeCloseTo(2.2, 12);
    expect(data.currents['reference']).toBe(1e-3);
    expect(data.currents['Rref']).toBeCloseTo(1e-3, 15);
    expect(Object.keys(data.nodes)).not.toContain(GROUND);
    const diode = data.devices['D1'];
    expect(diode?.['kind']).toBe('diode');
    expect(diode?.['current'] as number).toBeCloseTo((5 - (data.nodes['anode'] ?? 0)) / 4300, 12);
    expect(data.currents['D1']).toBeCloseTo(diode?.['current'] as number, 15);
  });

  it('is what JSON.stringify writes, and survives a round trip unchanged', () => {
    expect(JSON.parse(JSON.stringify(op))).toEqual(operatingPointToJson(op));
  });

  it('records the analysis conditions', () => {
    const data = operatingPoint(circuit, { temperature: 350 }).toJSON();
    expect(data.temperature).toBe(350);
    // Vt = k·T/q with the SI 2019 exact constants (BIPM, SI Brochure, 9th ed., 2019, Table 1).
    expect(data.thermalVoltage).toBeCloseTo((1.380649e-23 * 350) / 1.602176634e-19, 15);
    expect(data.strategy).toBe(op.strategy);
  });
});
