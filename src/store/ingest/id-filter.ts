/**
 * Which object ids of a load may occur more than once, in memory that does not grow with the file:
 * a Bloom filter (Bloom 1970, Commun. ACM 13, 422) over the ids as they stream past. An id whose
 * every probe bit is already set is a candidate duplicate: either a true repeat or a false
 * positive. Candidates are few (the filter is sized at about 64 bits per expected row with 8
 * probes: false-positive rate ≈ (1 − e^(−8/64))^8 ≈ 4·10⁻⁸) and the loading thread settles them
 * exactly with one SQL look-up of just those ids, so no id is ever reported falsely and none is missed.
 * Probe positions use double hashing, h1 + i·h2 (Kirsch & Mitzenmacher 2006, ESA 2006, LNCS 4168).
 */
export interface IdFilter {
  /** Record an id; true when it is a candidate duplicate (it may have been seen before). */
  add(id: string): boolean;
  /** The candidate ids so far (at most maxCandidates; see overflowed). */
  readonly candidates: ReadonlySet<string>;
  /** More candidates than maxCandidates: the caller must check every id instead. */
  readonly overflowed: boolean;
}

const PROBES = 8;
const MIN_BITS = 2 ** 16;
/** 2^28 bits = 32 MiB: the memory cap (about 4 million rows at the design rate; more rows raise the rate). */
const MAX_BITS = 2 ** 28;

export function createIdFilter(expectedRows: number, maxCandidates = 100_000): IdFilter {
  let bits = MIN_BITS;
  while (bits < expectedRows * 64 && bits < MAX_BITS) bits *= 2;
  const words = new Uint32Array(bits / 32);
  const mask = bits - 1;
  const candidates = new Set<string>();
  let overflowed = false;
  return {
    add(id: string): boolean {
      // Two independent 32-bit hashes of the UTF-16 code units: FNV-1a and a multiplicative mix.
      let h1 = 0x811c9dc5;
      let h2 = 0x9e3779b9;
      for (let i = 0; i < id.length; i++) {
        const c = id.charCodeAt(i);
        h1 = Math.imul(h1 ^ c, 0x01000193);
        h2 = Math.imul(h2 ^ c, 0x5bd1e995);
        h2 ^= h2 >>> 15;
      }
      h2 = (Math.imul(h2 ^ (h2 >>> 13), 0xc2b2ae35) | 1) >>> 0;
      let seen = true;
      for (let k = 0; k < PROBES; k++) {
        const bit = ((h1 >>> 0) + k * h2) & mask;
        const w = bit >>> 5;
        const b = 1 << (bit & 31);
        if ((words[w] & b) === 0) {
          seen = false;
          words[w] |= b;
        }
      }
      if (seen) {
        if (candidates.size < maxCandidates) candidates.add(id);
        else overflowed = true;
      }
      return seen;
    },
    candidates,
    get overflowed() {
      return overflowed;
    },
  };
}
