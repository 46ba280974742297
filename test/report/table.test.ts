import { describe, expect, it } from 'vitest';
import { cell, renderTable } from '../../src/index.js';

describe('renderTable', () => {
  // The layout the library chose for its tables, widths counted by hand (common practice, no source).
  it('pads every column to its widest cell and right-aligns numeric columns', () => {
    const text = renderTable({
      title: 'Supply rails',
      columns: [{ header: 'rail' }, { header: 'voltage', align: 'right' }],
      rows: [
        ['vcc', '9 V'],
        ['negative', '-12 V'],
      ],
    });
    expect(text.split('\n')).toEqual([
      'Supply rails',
      'rail      voltage',
      '────────  ───────',
      'vcc           9 V',
      'negative    -12 V',
    ]);
  });

  it('counts µ and Ω as one character each when aligning', () => {
    const text = renderTable({
      title: 't',
      columns: [{ header: 'x', align: 'right' }],
      rows: [['10 µF'], ['4.7 kΩ']],
    });
    expect(text.split('\n').slice(3)).toEqual([' 10 µF', '4.7 kΩ']);
  });

  it('says (none) for a table without rows', () => {
    expect(renderTable({ title: 'Diodes', columns: [{ header: 'device' }], rows: [] })).toContain('(none)');
  });
});

describe('cell', () => {
  // SI prefixes: BIPM, The International System of Units (SI Brochure), 9th edition, 2019, Table 7.
  it('writes finite values in engineering notation with the digits asked for', () => {
    expect(cell(0.0021947, 'A', 4)).toBe('2.195 mA');
    expect(cell(1178.2, 'Ω', 3)).toBe('1.18 kΩ');
  });

  it('writes infinite values as ∞ with their unit', () => {
    expect(cell(Number.POSITIVE_INFINITY, 'Ω', 4)).toBe('∞ Ω');
    expect(cell(Number.NEGATIVE_INFINITY, undefined, 4)).toBe('−∞');
  });
});
