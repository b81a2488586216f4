/**
 * The page packs a large request body slice by slice (client/src/api.ts `packBody`). The body must
 * parse to exactly the request a single JSON.stringify gives, also when a slice boundary falls
 * inside a surrogate pair: JSON.stringify escapes a lone surrogate as \uXXXX and JSON.parse joins
 * two such escapes back into the pair (ECMA-262, QuoteJSONString and JSON.parse).
 */
import { describe, expect, it } from 'vitest';
import { packBody } from '../../client/src/api.js';

const SLICE = 1 << 20; // PACK_CHARS in client/src/api.ts

describe('packBody', () => {
  it('gives the same JSON as one JSON.stringify, across slice boundaries and split surrogate pairs', async () => {
    const csv = 'x,"a ""q"" \\ b"\r\n' + 'a'.repeat(SLICE - 18) + '😀\t\u0001é\n' + '1,2\n'.repeat(1000);
    expect(csv.charCodeAt(SLICE - 1)).toBeGreaterThanOrEqual(0xd800); // the pair straddles the first boundary
    const rest = { column: 2, csvOptions: { header: true }, families: ['normal'], evidence: true };
    const stages: string[] = [];
    const blob = await packBody(csv, rest, (s) => stages.push(s.stage));
    expect(JSON.parse(await blob.text())).toEqual({ csv, ...rest });
    expect(blob.type).toBe('application/json');
    expect(stages.filter((s) => s === 'packing').length).toBe(2);
  });

  it('handles an empty rest and an empty text', async () => {
    expect(JSON.parse(await (await packBody('', {}, () => undefined)).text())).toEqual({ csv: '' });
    expect(JSON.parse(await (await packBody('a\n1\n', {}, () => undefined)).text())).toEqual({ csv: 'a\n1\n' });
  });
});
