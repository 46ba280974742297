/**
 * Seeded pseudo-random numbers for synthetic measurements: the mulberry32 generator (common practice,
 * no source) and standard normal deviates by the Box-Muller transform (G. E. P. Box and M. E. Muller,
 * Ann. Math. Statist. 29(2), 1958).
 */

/** A function returning standard normal deviates, the same sequence for the same seed. */
export function normalDeviates(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => {
    const u = 1 - uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
}
