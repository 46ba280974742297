/**
 * A reader of the Matrix Market exchange format, coordinate matrices only (Boisvert, Pozo &
 * Remington, "The Matrix Market exchange formats: initial design", NIST IR 5935, 1996): fields
 * real, integer, complex and pattern; symmetries general, symmetric, skew-symmetric and hermitian.
 * The result is a square compressed-column matrix with duplicates summed and every diagonal entry
 * present (compressPattern's convention).
 *
 * Key to the names: `n` order; `Ap`/`Ai` the pattern; `Ax`/`Az` real/imaginary values, one per
 * pattern entry (Az is null for a real file).
 */
import { compressPattern } from './csc.js';
import type { CscPattern } from './types.js';

/** A square matrix read from a Matrix Market file. */
export interface MatrixMarketMatrix {
  readonly pattern: CscPattern;
  readonly Ax: Float64Array;
  /** Imaginary parts, or null when the file's field is not complex. */
  readonly Az: Float64Array | null;
  readonly field: 'real' | 'integer' | 'complex' | 'pattern';
  readonly symmetry: 'general' | 'symmetric' | 'skew-symmetric' | 'hermitian';
}

const FIELDS = ['real', 'integer', 'complex', 'pattern'] as const;
const SYMMETRIES = ['general', 'symmetric', 'skew-symmetric', 'hermitian'] as const;

/**
 * Parse the text of a coordinate Matrix Market file of a square matrix. Throws a SyntaxError that
 * names the line for a malformed header, size line or entry, and a RangeError for a matrix that is
 * not square or an index out of range. A pattern file gets the value 1 on every entry.
 */
export function parseMatrixMarket(text: string): MatrixMarketMatrix {
  const lines = text.split(/\r?\n/);
  const header = (lines[0] ?? '').trim().toLowerCase().split(/\s+/);
  if (header[0] !== '%%matrixmarket' || header[1] !== 'matrix' || header[2] !== 'coordinate') {
    throw new SyntaxError('line 1: expected "%%MatrixMarket matrix coordinate <field> <symmetry>"');
  }
  const field = FIELDS.find((f) => f === header[3]);
  const symmetry = SYMMETRIES.find((s) => s === header[4]);
  if (field === undefined) throw new SyntaxError(`line 1: unknown field "${header[3] ?? ''}"`);
  if (symmetry === undefined) throw new SyntaxError(`line 1: unknown symmetry "${header[4] ?? ''}"`);
  let at = 1;
  while (at < lines.length && (lines[at]!.trim() === '' || lines[at]!.trimStart().startsWith('%'))) at++;
  const size = (lines[at] ?? '').trim().split(/\s+/).map(Number);
  if (size.length !== 3 || !size.every((v) => Number.isInteger(v) && v >= 0)) {
    throw new SyntaxError(`line ${at + 1}: expected "rows columns entries"`);
  }
  const [rowsCount, colsCount, entries] = size as [number, number, number];
  if (rowsCount !== colsCount) throw new RangeError(`the matrix is ${rowsCount}×${colsCount}, not square`);
  const n = rowsCount;
  const mirrored = symmetry !== 'general';
  const capacity = mirrored ? 2 * entries : entries;
  const rows = new Int32Array(capacity);
  const cols = new Int32Array(capacity);
  const re = new Float64Array(capacity);
  const im = new Float64Array(capacity);
  const perLine = field === 'complex' ? 4 : field === 'pattern' ? 2 : 3;
  let t = 0;
  let read = 0;
  for (at++; at < lines.length && read < entries; at++) {
    const line = lines[at]!.trim();
    if (line === '' || line.startsWith('%')) continue;
    const parts = line.split(/\s+/);
    const values = parts.map(Number);
    if (parts.length < perLine || values.slice(0, perLine).some((v) => Number.isNaN(v))) {
      throw new SyntaxError(`line ${at + 1}: expected ${perLine} numbers`);
    }
    const i = values[0]! - 1;
    const j = values[1]! - 1;
    if (!(Number.isInteger(i) && Number.isInteger(j) && i >= 0 && i < n && j >= 0 && j < n)) {
      throw new RangeError(`line ${at + 1}: index (${i + 1}, ${j + 1}) outside 1…${n}`);
    }
    const vr = field === 'pattern' ? 1 : values[2]!;
    const vi = field === 'complex' ? values[3]! : 0;
    rows[t] = i;
    cols[t] = j;
    re[t] = vr;
    im[t++] = vi;
    if (mirrored && i !== j) {
      const sign = symmetry === 'skew-symmetric' ? -1 : 1;
      rows[t] = j;
      cols[t] = i;
      re[t] = sign * vr;
      im[t++] = symmetry === 'hermitian' ? -vi : sign * vi;
    }
    read++;
  }
  if (read < entries) throw new SyntaxError(`the file ends after ${read} of ${entries} entries`);
  const { pattern, slots } = compressPattern(n, rows.subarray(0, t), cols.subarray(0, t));
  const nnz = pattern.Ap[n]!;
  const Ax = new Float64Array(nnz);
  const Az = field === 'complex' ? new Float64Array(nnz) : null;
  for (let e = 0; e < t; e++) {
    Ax[slots[e]!]! += re[e]!;
    if (Az !== null) Az[slots[e]!]! += im[e]!;
  }
  return { pattern, Ax, Az, field, symmetry };
}

/** Write a square matrix as coordinate Matrix Market text (general symmetry, 1-based indices). */
export function formatMatrixMarket(
  pattern: CscPattern,
  Ax: Float64Array,
  Az: Float64Array | null = null,
): string {
  const { n, Ap, Ai } = pattern;
  const nnz = Ap[n]!;
  const out: string[] = [
    `%%MatrixMarket matrix coordinate ${Az === null ? 'real' : 'complex'} general`,
    `${n} ${n} ${nnz}`,
  ];
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const v = Az === null ? `${Ax[p]!}` : `${Ax[p]!} ${Az[p]!}`;
      out.push(`${Ai[p]! + 1} ${j + 1} ${v}`);
    }
  }
  return `${out.join('\n')}\n`;
}
