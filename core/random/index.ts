/**
 * Seeded pseudo-random numbers. xoshiro128** (Blackman & Vigna 2018, "Scrambled linear
 * pseudorandom number generators", arXiv:1805.01407) seeded through SplitMix32-style mixing.
 * Streams: `createRng(seed, stream)` gives an independent generator per (seed, stream) pair, so a
 * bootstrap replicate i always sees the same numbers whichever worker runs it.
 */
export interface Rng {
  /** Uniform on the open interval (0, 1), 53-bit resolution. */
  uniform(): number;
  /** Standard normal variate. */
  normal(): number;
  /** Standard exponential variate. */
  exponential(): number;
  /** Gamma(shape, 1) variate. */
  gamma(shape: number): number;
}

function mix32(x: number): number {
  // Murmur3 finaliser (Appleby), a good 32-bit avalanche.
  x = Math.imul(x ^ (x >>> 16), 0x85ebca6b);
  x = Math.imul(x ^ (x >>> 13), 0xc2b2ae35);
  return (x ^ (x >>> 16)) >>> 0;
}

export function createRng(seed: number, stream = 0): Rng {
  if (!Number.isFinite(seed)) throw new RangeError(`seed must be a finite number, got ${String(seed)}`);
  const lo = seed >>> 0;
  const hi = Math.floor(seed / 4294967296) >>> 0;
  let a = mix32(lo ^ 0x9e3779b9);
  let b = mix32(hi ^ mix32(a + 0x7f4a7c15));
  let c = mix32((stream >>> 0) ^ mix32(b + 0x632be59b));
  let d = mix32(Math.floor(stream / 4294967296) ^ mix32(c + 0x1b873593));
  if ((a | b | c | d) === 0) a = 1;
  function next32(): number {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result;
  }
  function rotl(x: number, k: number): number {
    return (x << k) | (x >>> (32 - k));
  }
  // Warm up so that nearby seeds decorrelate.
  for (let i = 0; i < 8; i++) next32();
  let spare = Number.NaN;
  const rng: Rng = {
    uniform(): number {
      // 53 bits: 27 from one draw, 26 from another; +0.5 ulp keeps the result in (0, 1).
      const x = next32() >>> 5;
      const y = next32() >>> 6;
      return (x * 67108864 + y + 0.5) / 9007199254740992;
    },
    normal(): number {
      // Marsaglia polar method.
      if (!Number.isNaN(spare)) {
        const s = spare;
        spare = Number.NaN;
        return s;
      }
      let u: number, v: number, s: number;
      do {
        u = 2 * rng.uniform() - 1;
        v = 2 * rng.uniform() - 1;
        s = u * u + v * v;
      } while (s >= 1 || s === 0);
      const f = Math.sqrt((-2 * Math.log(s)) / s);
      spare = v * f;
      return u * f;
    },
    exponential(): number {
      return -Math.log(rng.uniform());
    },
    gamma(shape: number): number {
      // Marsaglia & Tsang (2000), ACM TOMS 26:363-372; shape < 1 by the boost U^(1/shape).
      if (!(shape > 0)) throw new RangeError(`gamma shape must be > 0, got ${shape}`);
      if (shape < 1) {
        const g = rng.gamma(shape + 1);
        return g * Math.exp(Math.log(rng.uniform()) / shape);
      }
      const dd = shape - 1 / 3;
      const cc = 1 / Math.sqrt(9 * dd);
      for (;;) {
        let x: number, v: number;
        do {
          x = rng.normal();
          v = 1 + cc * x;
        } while (v <= 0);
        v = v * v * v;
        const u = rng.uniform();
        if (u < 1 - 0.0331 * x * x * x * x) return dd * v;
        if (Math.log(u) < 0.5 * x * x + dd * (1 - v + Math.log(v))) return dd * v;
      }
    },
  };
  return rng;
}
