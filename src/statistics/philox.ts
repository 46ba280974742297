/**
 * Philox4x32-10, the counter-based generator of J. K. Salmon, M. A. Moraes, R. O. Dror and D. E. Shaw
 * ("Parallel random numbers: as easy as 1, 2, 3", SC '11, 2011): four 32-bit words of output are a
 * keyed bijection of a four-word counter, so draw number (sample, stream) is computed directly, with
 * no state carried from one draw to the next. That is what lets any worker compute any sample.
 *
 * Key to the names: `c0…c3` counter words, `k0`, `k1` key words, `out` the four output words.
 */

const M0 = 0xd2511f53;
const M1 = 0xcd9e8d57;
const W0 = 0x9e3779b9;
const W1 = 0xbb67ae85;
const TWO_POW_MINUS_16 = 1 / 0x10000;

/**
 * The high 32 bits of the 64-bit product of two unsigned 32-bit words, exact in doubles: with
 * b = b₁·2¹⁶ + b₀, a·b₁ and a·b₀ are below 2⁴⁸, and ⌊a·b/2³²⌋ = ⌊(a·b₁ + ⌊a·b₀/2¹⁶⌋)/2¹⁶⌋.
 */
function mulHigh(a: number, b: number): number {
  const low = Math.floor(a * (b & 0xffff) * TWO_POW_MINUS_16);
  return Math.floor((a * (b >>> 16) + low) * TWO_POW_MINUS_16);
}

/**
 * out ← Philox4x32-10(counter c0…c3, key k0, k1), four unsigned 32-bit words. Returns `out`.
 */
export function philox4x32(
  c0: number,
  c1: number,
  c2: number,
  c3: number,
  k0: number,
  k1: number,
  out: Uint32Array,
): Uint32Array {
  c0 >>>= 0;
  c1 >>>= 0;
  c2 >>>= 0;
  c3 >>>= 0;
  k0 >>>= 0;
  k1 >>>= 0;
  for (let round = 0; round < 10; round++) {
    if (round > 0) {
      k0 = (k0 + W0) >>> 0;
      k1 = (k1 + W1) >>> 0;
    }
    const high0 = mulHigh(M0, c0);
    const low0 = Math.imul(M0, c0) >>> 0;
    const high1 = mulHigh(M1, c2);
    const low1 = Math.imul(M1, c2) >>> 0;
    c0 = (high1 ^ c1 ^ k0) >>> 0;
    c1 = low1;
    c2 = (high0 ^ c3 ^ k1) >>> 0;
    c3 = low0;
  }
  out[0] = c0;
  out[1] = c1;
  out[2] = c2;
  out[3] = c3;
  return out;
}
