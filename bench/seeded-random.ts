/**
 * A seeded generator (mulberry32, a public-domain 32-bit generator; the constants are its
 * author's), so every run of a benchmark measures the same input.
 *
 * @example
 * const random = mulberry32(20240603);
 * random(); // a number in [0, 1), the same on every run
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
