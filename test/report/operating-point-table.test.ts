import { describe, expect, it } from 'vitest';
import {
  Circuit,
  formatOperatingPoint,
  formatValue,
  GROUND,
  operatingPoint,
  operatingPointTables,
} from '../../src/index.js';

/** 10 V across 1 kΩ and 4 kΩ in series: 8 V at the tap and 2 mA (Ohm's law; common practice, no source). */
function divider(): Circuit {
  return new Circuit()
    .voltageSource('input', 'in', GROUND, { dc: 10 })
    .resistor('Rtop', 'in', 'tap', '1k')
    .resistor('Rbottom', 'tap', GROUND, '4k');
}

/** The row of `table` whose first cell is `first`. */
function rowOf(
  tables: ReturnType<typeof operatingPointTables>,
  title: string,
  first: string,
): readonly string[] {
  const table = tables.find((t) => t.title.startsWith(title));
  const row = table?.rows.find((r) => r[0] === first);
  if (row === undefined) throw new Error(`no row ${first} in ${title}`);
  return row;
}

describe('formatOperatingPoint', () => {
  it('lists node voltages of a divider as Ohm’s law gives them, ground left out', () => {
    const tables = operatingPointTables(operatingPoint(divider()));
    expect(rowOf(tables, 'Node voltages', 'tap')).toEqual(['tap', '8 V']);
    expect(rowOf(tables, 'Node voltages', 'in')).toEqual(['in', '10 V']);
    expect(tables[0]!.rows.some((r) => r[0] === GROUND)).toBe(false);
  });

  it('lists element currents with the direction each is counted in', () => {
    const tables = operatingPointTables(operatingPoint(divider()));
    expect(rowOf(tables, 'Element currents', 'Rtop')).toEqual(['Rtop', 'resistor', 'in → tap', '2 mA']);
    // The source delivers power, so by the passive sign convention its current is negative.
    expect(rowOf(tables, 'Element currents', 'input')).toEqual([
      'input',
      'voltage-source',
      'in → gnd',
      '-2 mA',
    ]);
  });

  it('gives a bipolar transistor its region and small-signal parameters', () => {
    // Base held at 0.7 V, collector at 5 V: forward-active, and gm = ic/Vt
    // (Sedra & Smith, Microelectronic Circuits, 7th ed., 2015, eq. 7.14).
    const circuit = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 5 })
      .voltageSource('baseBias', 'base', GROUND, { dc: 0.7 })
      .resistor('Rc', 'vcc', 'collector', '1k')
      .bjt('Q1', { collector: 'collector', base: 'base', emitter: GROUND }, { polarity: 'npn' });
    const op = operatingPoint(circuit);
    const q = op.bjt('Q1');
    const row = rowOf(operatingPointTables(op, { digits: 3 }), 'Bipolar transistors', 'Q1');
    expect(row[1]).toBe('forward-active');
    const gm = q.ic / op.thermalVoltage;
    expect(Math.abs(q.gm - gm) / gm).toBeLessThan(1e-3);
    expect(row).toContain('700 mV');
    // Columns: device, region, vbe, vce, ic, ib, gm, …
    expect(row[6]).toBe(formatValue(gm, 'S', { digits: 3 }));
  });

  it('gives a MOSFET its threshold and overdrive', () => {
    // vgs = 2 V, Vth0 = 0.7 V by default: overdrive 1.3 V and id = ½·β·Vov² = 845 µA with β = 1 mA/V²
    // (Shichman & Hodges, IEEE J. Solid-State Circuits 3(3), 1968, square law).
    const circuit = new Circuit()
      .voltageSource('supply', 'vdd', GROUND, { dc: 5 })
      .voltageSource('gateBias', 'gate', GROUND, { dc: 2 })
      .resistor('Rd', 'vdd', 'drain', '1k')
      .mosfet('amplifier', { drain: 'drain', gate: 'gate', source: GROUND }, { polarity: 'nmos' });
    const row = rowOf(operatingPointTables(operatingPoint(circuit)), 'MOSFETs', 'amplifier');
    expect(row.slice(0, 7)).toEqual([
      'amplifier',
      'saturation',
      '2 V',
      '4.155 V',
      '845 µA',
      '700 mV',
      '1.3 V',
    ]);
  });

  it('prints a heading, then each table separated by a blank line', () => {
    const text = formatOperatingPoint(operatingPoint(divider()));
    const blocks = text.split('\n\n');
    expect(blocks[0]).toMatch(/^Operating point at 298\.15 K \(Vt = 25\.69 mV\), linear/);
    expect(blocks.slice(1).map((b) => b.split('\n')[0])).toEqual([
      'Node voltages (to ground)',
      'Element currents',
    ]);
  });

  it('rejects a number of digits that formatValue would reject', () => {
    expect(() => formatOperatingPoint(operatingPoint(divider()), { digits: 0 })).toThrow(
      expect.objectContaining({ code: 'invalid-value' }),
    );
  });
});
