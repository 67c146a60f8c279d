/**
 * A small seeded pseudorandom generator: xoshiro128** (32-bit state words, period 2^128 − 1),
 * each Monte Carlo sample with a stream of its own, seeded from (seed, sample index) by the
 * SplitMix32 finaliser. A sample's draws therefore depend only on the seed and its index, never
 * on which worker ran it or in what order: one worker and N workers give the same numbers.
 * Uniform numbers in [0, 1) take the top 24 bits (exact in a double); normal deviates come from
 * the Box–Muller transform.
 * Source: Blackman & Vigna, "Scrambled linear pseudorandom number generators", ACM TOMS 47(4)
 * (2021), xoshiro128** (rotation 7, multipliers 5 and 9, shift 9, rotation 11); Steele, Lea &
 * Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014 (SplitMix; here its
 * 32-bit finaliser constants 0x85ebca6b and 0xc2b2ae35, which are MurmurHash3's fmix32); Box &
 * Muller, "A note on the generation of random normal deviates", Ann. Math. Stat. 29 (1958).
 * Not for cryptography. Cost O(1) per number.
 */
export class SeededRandom {
  private readonly s = new Uint32Array(4);
  private spare: number | undefined;

  /** The stream of sample `index` of a run seeded with `seed` (any safe integer). */
  static forSample(seed: number, index: number): SeededRandom {
    return new SeededRandom(seed, index);
  }

  /**
   * A generator started from four given state words (not all zero), for checking the outputs
   * against the published reference code.
   */
  static fromState(words: readonly [number, number, number, number]): SeededRandom {
    const random = new SeededRandom(0, 0);
    random.s.set(words.map((w) => w >>> 0));
    return random;
  }

  private constructor(seed: number, index: number) {
    let x = (Math.floor(seed) ^ Math.imul(index + 1, 0x9e3779b9)) >>> 0;
    const high = Math.floor(seed / 0x100000000) >>> 0;
    for (let i = 0; i < 4; i++) {
      x = (x + 0x9e3779b9 + high) >>> 0;
      let z = x;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
      this.s[i] = (z ^ (z >>> 16)) >>> 0;
    }
    if ((this.s[0]! | this.s[1]! | this.s[2]! | this.s[3]!) === 0) this.s[0] = 1;
  }

  /** The next 32-bit output of xoshiro128**. */
  nextUint32(): number {
    const s = this.s;
    const rotl = (v: number, k: number): number => ((v << k) | (v >>> (32 - k))) >>> 0;
    const result = Math.imul(rotl(Math.imul(s[1]!, 5) >>> 0, 7), 9) >>> 0;
    const t = (s[1]! << 9) >>> 0;
    s[2] = s[2]! ^ s[0]!;
    s[3] = s[3]! ^ s[1]!;
    s[1] = s[1]! ^ s[2]!;
    s[0] = s[0]! ^ s[3]!;
    s[2] = s[2]! ^ t;
    s[3] = rotl(s[3]!, 11);
    return result;
  }

  /** Uniform in [0, 1). */
  uniform(): number {
    return (this.nextUint32() >>> 8) / 16777216;
  }

  /** Standard normal deviate (mean 0, standard deviation 1), Box–Muller. */
  normal(): number {
    if (this.spare !== undefined) {
      const v = this.spare;
      this.spare = undefined;
      return v;
    }
    const u1 = 1 - this.uniform(); // (0, 1]: the logarithm stays finite
    const u2 = this.uniform();
    const r = Math.sqrt(-2 * Math.log(u1));
    this.spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  }
}
