/**
 * Reproducible pseudo-random numbers for noisy test data: mulberry32 (a public-domain 32-bit
 * generator) and a Box-Muller normal deviate. Seeded, so every run of a test sees the same data.
 * Source: Box & Muller, "A note on the generation of random normal deviates", Ann. Math. Statist.
 * 29 (1958) 610-611.
 */
export function seededNormal(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = (): number => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}
