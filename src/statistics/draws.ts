/**
 * Draws that depend only on (seed, sample, stream): stream j of sample k is the Philox block with
 * counter (k, j, attempt, 0) and key (seed mod 2³², ⌊seed/2³²⌋). Nothing carries from one draw to
 * the next, so a sample gives the same numbers whichever worker computes it and in whatever order.
 *
 * Uniform numbers take 53 bits from two output words. Normal numbers come from the Box–Muller
 * transform (G. E. P. Box and M. E. Muller, "A note on the generation of random normal deviates",
 * Ann. Math. Statist. 29(2), 1958) and are truncated to [−3, 3] by rejection: a pair landing outside
 * is drawn again from the next `attempt` counter, which gives exactly the standard normal conditioned
 * on |z| ≤ 3.
 */
import { philox4x32 } from './philox.js';

/** The truncation of normal draws, in standard deviations. */
export const NORMAL_LIMIT = 3;

const TWO_POW_32 = 4294967296;
const TWO_POW_MINUS_53 = 2 ** -53;

/** The generator of one run: a seed (a whole number in [0, 2⁵³)) and scratch for the output words. */
export class Draws {
  readonly #k0: number;
  readonly #k1: number;
  readonly #words = new Uint32Array(4);

  constructor(seed: number) {
    this.#k0 = (seed % TWO_POW_32) >>> 0;
    this.#k1 = Math.floor(seed / TWO_POW_32) >>> 0;
  }

  /** A uniform number in [0, 1) for stream `stream` of sample `sample`. */
  uniform(sample: number, stream: number): number {
    const w = philox4x32(sample, stream, 0, 0, this.#k0, this.#k1, this.#words);
    return toUnit(w[0]!, w[1]!);
  }

  /** A standard normal number truncated to [−3, 3] for stream `stream` of sample `sample`. */
  normal(sample: number, stream: number): number {
    for (let attempt = 0; ; attempt++) {
      const w = philox4x32(sample, stream, attempt, 0, this.#k0, this.#k1, this.#words);
      // 1 − u lies in (0, 1], so the logarithm is finite.
      const radius = Math.sqrt(-2 * Math.log(1 - toUnit(w[0]!, w[1]!)));
      const z = radius * Math.cos(2 * Math.PI * toUnit(w[2]!, w[3]!));
      if (Math.abs(z) <= NORMAL_LIMIT) return z;
    }
  }
}

/** 53 bits of two 32-bit words as a number in [0, 1). */
function toUnit(high: number, low: number): number {
  return ((high >>> 5) * 67108864 + (low >>> 6)) * TWO_POW_MINUS_53;
}
