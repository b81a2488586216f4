/**
 * Parquet input (Apache Parquet, read by the pure-JavaScript `hyparquet`): a file that starts with
 * the Parquet magic bytes "PAR1" is read into the same CSV text the reader takes (header from the
 * schema's top-level columns; numbers written with JavaScript's shortest round-trip form, so each
 * double reads back as the same double; nulls as blank cells; text quoted per RFC 4180), so a Parquet
 * file gives exactly the report of the same data as CSV. The table is held in memory once as text:
 * for files past memory, convert to CSV and use the piece reader.
 */
import { closeSync, openSync, readSync } from 'node:fs';
import { asyncBufferFromFile, parquetMetadataAsync, parquetReadObjects, parquetSchema } from 'hyparquet';
import { InputError } from '../core/index.js';
import type { InputText } from './read-input.js';

/** Whether `file` starts with the Parquet magic number (Parquet format specification: "PAR1"). */
export function isParquetFile(file: string): boolean {
  if (file === '-') return false;
  let fd: number;
  try {
    fd = openSync(file, 'r');
  } catch {
    return false;
  }
  try {
    const head = Buffer.alloc(4);
    return readSync(fd, head, 0, 4, 0) === 4 && head.toString('latin1') === 'PAR1';
  } catch {
    return false; // a folder or an unreadable device: the text reader says what it is
  } finally {
    closeSync(fd);
  }
}

function cell(v: unknown): string {
  if (v === null || v === undefined) return '';
  let s: string;
  if (typeof v === 'number') s = String(v);
  else if (typeof v === 'bigint') s = v.toString();
  else if (typeof v === 'boolean') s = v ? '1' : '0';
  else if (v instanceof Date) s = v.toISOString();
  else if (typeof v === 'string') s = v;
  else s = JSON.stringify(v);
  return /[",\r\n]/.test(s) || s !== s.trim() ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The Parquet file as CSV text for the reader (comma-delimited, with a header). */
export async function parquetAsText(file: string): Promise<InputText> {
  let rows: Record<string, unknown>[];
  let names: string[];
  let bytes: number;
  try {
    const buffer = await asyncBufferFromFile(file);
    bytes = buffer.byteLength;
    const metadata = await parquetMetadataAsync(buffer);
    names = parquetSchema(metadata).children.map((c) => c.element.name);
    rows = (await parquetReadObjects({ file: buffer, metadata })) as Record<string, unknown>[];
  } catch (e) {
    throw new InputError(`cannot read ${JSON.stringify(file)} as Parquet: ${e instanceof Error ? e.message : String(e)}`, {}, 'bad-input');
  }
  const lines = [names.map(cell).join(',')];
  for (const r of rows) lines.push(names.map((n) => cell(r[n])).join(','));
  return {
    text: `${lines.join('\n')}\n`,
    bytes,
    encoding: 'utf-8',
    warnings: [`read from Parquet: ${rows.length} rows, ${names.length} columns`],
  };
}
