/**
 * Which shard a series belongs to: a stable, documented hash of its key, so that N independent
 * processes (a job array on a batch scheduler, indexed jobs, a pipeline step run N times) each
 * analyse a disjoint part of the series and together analyse all of them.
 *
 * Hash: 32-bit FNV-1a (Fowler, Noll & Vo; IETF draft-eastlake-fnv) over the key's UTF-8 bytes;
 * shard = hash mod N, shards numbered 0 … N − 1 (so a Kubernetes JOB_COMPLETION_INDEX or an array
 * task id counted from 0 is the shard index as it is). The hash depends only on the key's text,
 * never on the file's order, the machine or the run.
 */

const FNV_OFFSET = 0x811c9dc5;
const FNV_PRIME = 0x01000193;

/** 32-bit FNV-1a of the UTF-8 encoding of `key`, as an unsigned integer. */
export function fnv1a32(key: string): number {
  let h = FNV_OFFSET;
  for (let i = 0; i < key.length; i++) {
    let c = key.codePointAt(i) as number;
    if (c > 0xffff) i++; // a surrogate pair is one code point
    // UTF-8 bytes of the code point, hashed one by one.
    if (c < 0x80) {
      h = Math.imul(h ^ c, FNV_PRIME);
    } else if (c < 0x800) {
      h = Math.imul(h ^ (0xc0 | (c >> 6)), FNV_PRIME);
      h = Math.imul(h ^ (0x80 | (c & 0x3f)), FNV_PRIME);
    } else if (c < 0x10000) {
      if (c >= 0xd800 && c <= 0xdfff) c = 0xfffd; // a lone surrogate is encoded as U+FFFD, as TextEncoder does
      h = Math.imul(h ^ (0xe0 | (c >> 12)), FNV_PRIME);
      h = Math.imul(h ^ (0x80 | ((c >> 6) & 0x3f)), FNV_PRIME);
      h = Math.imul(h ^ (0x80 | (c & 0x3f)), FNV_PRIME);
    } else {
      h = Math.imul(h ^ (0xf0 | (c >> 18)), FNV_PRIME);
      h = Math.imul(h ^ (0x80 | ((c >> 12) & 0x3f)), FNV_PRIME);
      h = Math.imul(h ^ (0x80 | ((c >> 6) & 0x3f)), FNV_PRIME);
      h = Math.imul(h ^ (0x80 | (c & 0x3f)), FNV_PRIME);
    }
  }
  return h >>> 0;
}

/** A shard: index 0 … count − 1 of count. */
export interface Shard {
  readonly index: number;
  readonly count: number;
}

/** The shard (0-based) a series key belongs to among `count` shards. */
export function shardOf(key: string, count: number): number {
  return fnv1a32(key) % count;
}

/** Whether the series `key` is analysed by `shard` (every key belongs to exactly one shard). */
export function inShard(key: string, shard: Shard | null): boolean {
  return shard === null || shardOf(key, shard.count) === shard.index;
}
