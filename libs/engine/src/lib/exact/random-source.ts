/**
 * Seeded uniform random numbers: xoshiro128** (Blackman & Vigna 2021, "Scrambled linear
 * pseudorandom number generators", ACM TOMS 47:36) with its state filled from the seed by
 * SplitMix32 (the 32-bit variant of Steele, Lea & Flood 2014, "Fast splittable pseudorandom
 * number generators"). Small, fast with 32-bit integer arithmetic, and reproducible across
 * platforms, which Math.random is not.
 */
export class RandomSource {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;

  constructor(seed: number) {
    let state = seed >>> 0;
    // Mix the high part of large seeds in as well, so seeds beyond 2^32 stay distinct.
    state = (state ^ Math.floor(seed / 4294967296)) >>> 0;
    const next = (): number => {
      state = (state + 0x9e3779b9) >>> 0;
      let z = state;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
      return (z ^ (z >>> 16)) >>> 0;
    };
    this.s0 = next();
    this.s1 = next();
    this.s2 = next();
    this.s3 = next();
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /** The next 32 random bits as an unsigned integer. */
  nextUint32(): number {
    const result = Math.imul(rotateLeft(Math.imul(this.s1, 5), 7), 9) >>> 0;
    const t = this.s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotateLeft(this.s3, 11);
    return result;
  }

  /** Uniform on [0, 1) with 53 random bits. */
  nextDouble(): number {
    const high = this.nextUint32() >>> 5; // 27 bits
    const low = this.nextUint32() >>> 6; // 26 bits
    return (high * 67108864 + low) / 9007199254740992;
  }
}

function rotateLeft(x: number, bits: number): number {
  return (x << bits) | (x >>> (32 - bits));
}
