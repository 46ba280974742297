/**
 * Shift and invert on the sparse LU: the roots it finds are the ones the dense eigenvalue routine
 * finds for a circuit small enough for both, and on a circuit above the dense size they are the
 * closed-form poles of its sections.
 */
import { describe, expect, it } from 'vitest';
import { circuitPencil } from '../../src/analysis/pencil.js';
import { denseRoots, type RootValue } from '../../src/analysis/pencil-roots-dense.js';
import { sparseRootsNear } from '../../src/analysis/pencil-roots-sparse.js';
import { Circuit, DENSE_LIMIT, GROUND, operatingPoint, poles, QuiescentError } from '../../src/index.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

const never = () =>
  new QuiescentError({ code: 'singular', elements: [], nodes: [], reason: 'matrix' }, 'singular');

/** A ladder of RLC sections with varied values: 120 distinct poles, real and complex. */
function ladder(sections: number): Circuit {
  const c = new Circuit().voltageSource('signal', 'n0', GROUND, { ac: 1 });
  for (let k = 0; k < sections; k++) {
    c.resistor(`R${k}`, `n${k}`, `m${k}`, 10 + 3 * k);
    c.inductor(`L${k}`, `m${k}`, `n${k + 1}`, 1e-3 * (1 + 0.37 * Math.sin(k)));
    c.capacitor(`C${k}`, `n${k + 1}`, GROUND, 1e-6 * (1 + 0.5 * Math.cos(k)));
  }
  return c.resistor('load', `n${sections}`, GROUND, 50);
}

/** The `count` roots nearest j·ω0 (or its conjugate), nearest first. */
function nearest(roots: readonly RootValue[], omega0: number, count: number): RootValue[] {
  const distance = (r: RootValue) => Math.hypot(r.re, Math.abs(r.im) - omega0);
  return [...roots].sort((a, b) => distance(a) - distance(b) || b.im - a.im).slice(0, count);
}

describe('sparseRootsNear', () => {
  const pencil = circuitPencil(operatingPoint(ladder(60)));
  const dense = denseRoots(pencil, never);

  it('finds the roots nearest the origin that the dense routine finds', () => {
    // Source: the dense eigenvalue routine (ml-matrix, after JAMA) on the same pencil.
    expect(dense).toHaveLength(120);
    const sparse = sparseRootsNear(pencil, 0, 10, never);
    const want = nearest(dense, 0, 10);
    expect(sparse).toHaveLength(10);
    sparse.forEach((r, k) => {
      const w = want[k]!;
      expect(Math.hypot(r.re - w.re, r.im - w.im) / Math.hypot(w.re, w.im), `root ${k}`).toBeLessThan(1e-9);
    });
  });

  it('finds a resonance nearest a point of the imaginary axis, both members of its pair', () => {
    const omega0 = 2 * Math.PI * 1700;
    const sparse = sparseRootsNear(pencil, omega0, 2, never);
    const want = nearest(dense, omega0, 2);
    expect(sparse).toHaveLength(2);
    sparse.forEach((r, k) => {
      const w = want[k]!;
      expect(Math.hypot(r.re - w.re, r.im - w.im) / Math.hypot(w.re, w.im), `root ${k}`).toBeLessThan(1e-9);
    });
    expect(sparse[1]!.im).toBe(-sparse[0]!.im);
  });
});

describe('poles above the dense size', () => {
  // RC sections, each driven from the source: the poles are −1/(R_k·C_k), one per section.
  const sections = 1100;
  const circuit = new Circuit().voltageSource('signal', 'in', GROUND, { ac: 1 });
  const expected: number[] = [];
  for (let k = 0; k < sections; k++) {
    const r = 1e3 * (1 + k);
    const c = 1e-9 * (1 + 0.5 * Math.sin(k));
    circuit.resistor(`R${k}`, 'in', `x${k}`, r);
    circuit.capacitor(`C${k}`, `x${k}`, GROUND, c);
    expected.push(1 / (2 * Math.PI * r * c));
  }
  const op = operatingPoint(circuit);

  it('needs a limit and a frequency', () => {
    expect(op.system.n).toBeGreaterThan(DENSE_LIMIT);
    expectQuiescentError(() => poles(op), 'invalid-value', 'limit');
    expectQuiescentError(() => poles(op, { limit: 5 }), 'invalid-value', 'near');
  });

  it('gives the lowest-frequency poles of the sections, by shift and invert', () => {
    // Source: each buffered section's time constant R·C (common practice, no source).
    const p = poles(op, { limit: 10, near: 0 });
    const want = [...expected].sort((a, b) => a - b).slice(0, 10);
    expect(p).toHaveLength(10);
    p.forEach((pole, k) => {
      expect(pole.imaginary).toBe(0);
      expect(Math.abs(pole.real + want[k]!) / want[k]!, `pole ${k}`).toBeLessThan(1e-9);
    });
  });
});
