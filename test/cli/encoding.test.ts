import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readInputText } from '../../cli/read-input.js';
import { runCli } from '../../cli/run.js';

const scratch = mkdtempSync(join(tmpdir(), 'plumbline-enc-'));
const put = (name: string, bytes: Buffer): string => {
  const p = join(scratch, name);
  writeFileSync(p, bytes);
  return p;
};

describe('input encodings', () => {
  const text = 'Spannung µm\n1.5\n2.5\n';

  it('reads UTF-8, with or without a byte-order mark', () => {
    // Source: RFC 3629 (UTF-8); Unicode §23.8 (U+FEFF as a signature; the CSV reader skips it).
    expect(readInputText(put('u8.csv', Buffer.from(text, 'utf8')))).toMatchObject({ text, encoding: 'utf-8' });
    const bom = readInputText(put('u8bom.csv', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text, 'utf8')])));
    expect(bom.text).toBe(`\uFEFF${text}`);
  });

  it('reads UTF-16 little- and big-endian files by their byte-order mark', () => {
    // Source: Unicode §23.8 (FF FE = UTF-16LE, FE FF = UTF-16BE).
    const le = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
    expect(readInputText(put('u16le.csv', le))).toMatchObject({ text, encoding: 'utf-16le' });
    const be = Buffer.from(Buffer.from(text, 'utf16le')).swap16();
    expect(readInputText(put('u16be.csv', Buffer.concat([Buffer.from([0xfe, 0xff]), be])))).toMatchObject({ text, encoding: 'utf-16be' });
  });

  it('falls back to Latin-1 for bytes that are not UTF-8, and says so', () => {
    // Source: ISO/IEC 8859-1 (0xB5 = µ); RFC 3629 (a lone 0xB5 byte is not valid UTF-8).
    const r = readInputText(put('latin1.csv', Buffer.from(text, 'latin1')));
    expect(r).toMatchObject({ text, encoding: 'latin-1' });
    expect(r.warnings.join(' ')).toContain('Latin-1');
  });

  it('a UTF-16 file analyses like the UTF-8 one', () => {
    // Source: Unicode §23.8; the same numbers must give the same report.
    const values = 'x\n3\n5\n7\n18\n43\n85\n';
    const run = (path: string): string => {
      let out = '';
      const code = runCli(['analyze', path, '--json', '--families', 'exponential'], { out: (s) => (out += s), err: () => undefined });
      expect(code).toBe(0);
      const r = JSON.parse(out);
      return JSON.stringify(r.candidates);
    };
    const u8 = run(put('v8.csv', Buffer.from(values, 'utf8')));
    const u16 = run(put('v16.csv', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(values, 'utf16le')])));
    expect(u16).toBe(u8);
  });
});
