/**
 * Seeded pseudo-random numbers that give the same bits on every machine: the generator uses only
 * 32-bit integer arithmetic (Math.imul, shifts, xor), so its integer stream is exact everywhere.
 *
 * Generator: xoshiro128** 1.1 (D. Blackman & S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47(4), 2021; reference code xoshiro128starstar.c at
 * prng.di.unimi.it). Its 128-bit state is filled by splitmix32: the golden-ratio increment
 * 0x9e3779b9 of SplitMix (G. Steele, D. Lea & C. Flood, OOPSLA 2014) followed by the fmix32
 * finaliser of MurmurHash3 (A. Appleby) — a common 32-bit adaptation (common practice).
 */

/** A stream of pseudo-random numbers; each call advances the shared state. */
export interface Random {
  /** Next 32-bit output as an unsigned integer in [0, 2^32). */
  nextUint32(): number;
  /** Uniform on [0, 1) with 53 random bits: a multiple of 2^-53. */
  uniform(): number;
  /** Standard normal N(0, 1) by Marsaglia's polar method. */
  normal(): number;
}

const GOLDEN = 0x9e3779b9;

function fmix32(h: number): number {
  // MurmurHash3 fmix32 (Appleby): a bijection on 32-bit words.
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/** The first `count` outputs of splitmix32 started from `state` (see the module comment). */
export function splitmix32(state: number, count: number): number[] {
  const out: number[] = [];
  let s = state >>> 0;
  for (let k = 0; k < count; k++) {
    s = (s + GOLDEN) >>> 0;
    out.push(fmix32(s));
  }
  return out;
}

/**
 * 32-bit FNV-1a hash of a string's UTF-16 code units (G. Fowler, L. C. Noll & K.-P. Vo; IETF
 * draft-eastlake-fnv): names a separate stream per matrix family so that two families with the
 * same seed do not draw the same numbers.
 */
export function streamId(name: string): number {
  let h = 0x811c9dc5;
  for (let k = 0; k < name.length; k++) {
    h ^= name.charCodeAt(k);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/**
 * A generator started from an explicit xoshiro128** state (four 32-bit words, not all zero).
 * Mostly for checking against the reference code; use createRandom for matrices.
 */
export function createRandomFromState(words: readonly [number, number, number, number]): Random {
  const s = Uint32Array.from(words);
  if (s[0] === 0 && s[1] === 0 && s[2] === 0 && s[3] === 0)
    throw new RangeError('words must not all be zero (xoshiro128** has no zero state)');
  let spare: number | undefined;

  function nextUint32(): number {
    // xoshiro128** 1.1, step for step as in xoshiro128starstar.c.
    const result = Math.imul(rotl(Math.imul(s[1]!, 5), 7), 9) >>> 0;
    const t = s[1]! << 9;
    s[2]! ^= s[0]!;
    s[3]! ^= s[1]!;
    s[1]! ^= s[2]!;
    s[0]! ^= s[3]!;
    s[2]! ^= t;
    s[3] = rotl(s[3]!, 11);
    return result;
  }

  function uniform(): number {
    // 27 + 26 bits as in genrand_res53 (Matsumoto & Nishimura's MT19937 reference code, 1998).
    const a = nextUint32() >>> 5;
    const b = nextUint32() >>> 6;
    return (a * 67108864 + b) / 9007199254740992;
  }

  function normal(): number {
    // Marsaglia's polar method (Marsaglia & Bray, SIAM Rev. 6 (1964) 260–264; Knuth, TAOCP
    // vol. 2, §3.4.1, Algorithm P). It needs Math.log, which ECMAScript does not require to be
    // correctly rounded: reproducibility relies on V8's Math.log being its own software port of
    // fdlibm (src/base/ieee754), hence the same bits on every machine for one V8 version (from
    // memory). Math.sqrt is correctly rounded by IEEE 754.
    if (spare !== undefined) {
      const z = spare;
      spare = undefined;
      return z;
    }
    for (;;) {
      const u = 2 * uniform() - 1;
      const v = 2 * uniform() - 1;
      const q = u * u + v * v;
      if (q > 0 && q < 1) {
        const f = Math.sqrt((-2 * Math.log(q)) / q);
        spare = v * f;
        return u * f;
      }
    }
  }

  return { nextUint32, uniform, normal };
}

/**
 * A generator for `seed` (an integer from 0 to 2^32 − 1) on stream `stream` (a 32-bit word,
 * e.g. streamId('uniform')). The state words are splitmix32(seed) xor splitmix32(stream).
 */
export function createRandom(seed: number, stream = 0): Random {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff)
    throw new RangeError(`seed must be an integer from 0 to 4294967295, got ${seed}`);
  if (!Number.isInteger(stream) || stream < 0 || stream > 0xffffffff)
    throw new RangeError(`stream must be an integer from 0 to 4294967295, got ${stream}`);
  const a = splitmix32(seed, 4);
  const b = stream === 0 ? [0, 0, 0, 0] : splitmix32(stream, 4);
  const words: [number, number, number, number] = [
    (a[0]! ^ b[0]!) >>> 0,
    (a[1]! ^ b[1]!) >>> 0,
    (a[2]! ^ b[2]!) >>> 0,
    (a[3]! ^ b[3]!) >>> 0,
  ];
  if (words.every((w) => w === 0)) words[0] = 1;
  return createRandomFromState(words);
}
