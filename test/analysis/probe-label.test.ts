import { describe, expect, it } from 'vitest';
import { probeLabel, ratioLabel } from '../../src/analysis/probe-label.js';
import { GROUND } from '../../src/circuit/elements.js';

// Source: docs/reports.md, "Labels": the project's own naming of probes (common practice, no source).
describe('probe labels', () => {
  it('name a node voltage by its node', () => {
    expect(probeLabel('collector')).toBe('collector');
    expect(probeLabel({ node: 'collector' })).toBe('collector');
    expect(probeLabel({ node: 'collector', reference: GROUND })).toBe('collector');
  });

  it('write a voltage between two nodes as a difference', () => {
    expect(probeLabel({ node: 'out', reference: 'midrail' })).toBe('out − midrail');
  });

  it('say in words that a current flows in an element', () => {
    expect(probeLabel({ element: 'Rload' })).toBe('current in Rload');
  });

  it('write a ratio with a division sign, or the output alone without an input', () => {
    expect(ratioLabel('collector', 'input')).toBe('collector ÷ input');
    expect(ratioLabel({ element: 'Rload' }, 'input')).toBe('current in Rload ÷ input');
    expect(ratioLabel('collector')).toBe('collector');
  });
});
