import { describe, expect, it } from 'vitest';
import { fnv1a32, inShard, shardOf } from '../../core/batch/index.js';

describe('fnv1a32: the documented shard hash', () => {
  // Test vectors of 32-bit FNV-1a from the FNV reference (Fowler/Noll/Vo; draft-eastlake-fnv
  // appendix) [from memory], each confirmed by an independent Python implementation over UTF-8 bytes.
  it.each([
    ['', 0x811c9dc5],
    ['a', 0xe40c292c],
    ['foobar', 0xbf9cf968],
  ])('FNV-1a(%j) = reference vector', (key, expected) => {
    expect(fnv1a32(key)).toBe(expected);
  });

  // Non-ASCII keys hash their UTF-8 bytes (Python: hashing s.encode('utf-8') byte by byte).
  it.each([
    ['Gauge Ünter', 0x6eb000b6],
    ['𝔸x', 0x1704b406],
  ])('hashes the UTF-8 bytes of %j', (key, expected) => {
    expect(fnv1a32(key)).toBe(expected);
  });
});

describe('shards partition the series', () => {
  it('every key falls in exactly one of N shards', () => {
    const keys = Array.from({ length: 500 }, (_, i) => `station-${i}`);
    for (const count of [1, 2, 3, 7]) {
      const seen = new Map<string, number>();
      for (let index = 0; index < count; index++) {
        for (const k of keys) if (inShard(k, { index, count })) seen.set(k, (seen.get(k) ?? 0) + 1);
      }
      expect(seen.size).toBe(keys.length);
      expect([...seen.values()].every((c) => c === 1)).toBe(true);
    }
  });

  it('spreads keys roughly evenly (each of 4 shards holds 20–30 % of 2000 keys)', () => {
    // Common practice, no source: a hash used for sharding should not starve a shard.
    const counts = [0, 0, 0, 0];
    for (let i = 0; i < 2000; i++) counts[shardOf(`G${i}`, 4)]! += 1;
    for (const c of counts) expect(c / 2000).toBeGreaterThan(0.2);
    for (const c of counts) expect(c / 2000).toBeLessThan(0.3);
  });

  it('no shard means every series', () => {
    expect(inShard('anything', null)).toBe(true);
  });
});
