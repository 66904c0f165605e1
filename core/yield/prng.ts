/**
 * The random numbers of the yield estimate: xoshiro128** (D. Blackman and S. Vigna, "Scrambled linear pseudorandom
 * number generators", ACM Transactions on Mathematical Software 47(4), article 36, 2021), seeded through SplitMix64
 * (G. L. Steele, D. Lea and C. H. Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014), as the
 * generator's authors recommend.
 *
 * Why these: xoshiro128** needs only 32-bit integer operations (Math.imul, shifts, xor), so JavaScript computes it
 * exactly and the same seed gives the same numbers on every machine and engine. The 64-bit SplitMix64 runs once per
 * stream, in BigInt.
 *
 * Streams: every tolerance draws from its own stream (stream id = FNV-1a 32-bit hash of its quantity name), so
 * adding or removing one tolerance leaves the others' draws unchanged. Stream s of seed S starts SplitMix64 at
 * S·2^32 + s and takes its first two outputs as the four 32-bit state words (low word first).
 */
const MASK64 = (1n << 64n) - 1n;

function splitMix64(state: bigint): { next: bigint; out: bigint } {
  const next = (state + 0x9e3779b97f4a7c15n) & MASK64;
  let z = next;
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return { next, out: z ^ (z >> 31n) };
}

/** FNV-1a, 32 bits, of a short ASCII name (the stream id of a tolerance quantity). */
export function streamId(name: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < name.length; i++) { h ^= name.charCodeAt(i); h = Math.imul(h, 0x01000193) >>> 0; }
  return h >>> 0;
}

export class Xoshiro128ss {
  private s0: number; private s1: number; private s2: number; private s3: number;

  /** Four 32-bit state words, not all zero. */
  constructor(s0: number, s1: number, s2: number, s3: number) {
    this.s0 = s0 | 0; this.s1 = s1 | 0; this.s2 = s2 | 0; this.s3 = s3 | 0;
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1; // the all-zero state is the one fixed point
  }

  /** The generator of stream `stream` (a 32-bit number) of `seed` (a whole number 0 … 2^32 − 1). */
  static fromSeed(seed: number, stream = 0): Xoshiro128ss {
    let st = (BigInt(seed >>> 0) << 32n) | BigInt(stream >>> 0);
    const a = splitMix64(st); st = a.next;
    const b = splitMix64(st);
    const w = (x: bigint, k: bigint) => Number((x >> k) & 0xffffffffn);
    return new Xoshiro128ss(w(a.out, 0n), w(a.out, 32n), w(b.out, 0n), w(b.out, 32n));
  }

  /** The next 32-bit output, as an unsigned number. */
  nextU32(): number {
    const s1 = this.s1;
    const r = Math.imul(rotl(Math.imul(s1, 5), 7), 9);
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return r >>> 0;
  }

  /**
   * A uniform number strictly inside (0, 1) with 53 random bits: (a·2^26 + b + ½)/2^53 from a = 27 and b = 26 bits
   * of two outputs (the 53-bit construction of the Mersenne Twister's genrand_res53, shifted by half a step so that
   * neither 0 nor 1 occurs and the inverse normal below is always finite).
   */
  uniform(): number {
    const a = this.nextU32() >>> 5, b = this.nextU32() >>> 6;
    return (a * 67108864 + b + 0.5) / 9007199254740992;
  }
}

function rotl(x: number, k: number): number { return (x << k) | (x >>> (32 - k)); }
