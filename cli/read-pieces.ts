/**
 * Reading one column of a large file without ever holding the file as one string: the bytes are
 * read in chunks (4 MiB by default: at 10^7 values 16 MiB pieces left ~70 MiB more garbage at the peak, measured here), decoded as a stream (UTF-8, or UTF-16 after its byte-order
 * mark, or Latin-1 when the bytes are not valid UTF-8, as cli/read-input.ts decides for a whole
 * file), cut after the last complete record and read piece by piece (core ColumnPieces). Gives what
 * readColumn gives on the whole text. Used for files past PIECES_MIN_BYTES, which also lifts the
 * limit of one JavaScript string (about 512 M characters).
 */
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { ColumnPieces, lastRecordEnd, type ColumnOptions, type ColumnResult } from '../core/index.js';

/** Files at least this large are read in pieces (common practice, no source: measured here, the whole-string read costs ~2 bytes of memory per character). */
export const PIECES_MIN_BYTES = 64 * 2 ** 20;

export interface PiecesRead {
  readonly read: ColumnResult;
  readonly bytes: number;
  readonly encoding: 'utf-8' | 'utf-16le' | 'utf-16be' | 'latin-1';
  readonly warnings: readonly string[];
}

/** The file's size when it is a regular file, else null (pipes, devices). */
export function regularFileSize(file: string): number | null {
  if (file === '-') return null;
  let fd: number;
  try {
    fd = openSync(file, 'r');
  } catch {
    return null; // the whole-string reader reports the error in its words
  }
  try {
    const st = fstatSync(fd);
    return st.isFile() ? st.size : null;
  } finally {
    closeSync(fd);
  }
}

class NotUtf8 extends Error {}

/** Characters the first piece holds at least (4 × the 64 Ki the delimiter guess and text check read). */
const FIRST_PIECE_CHARS = 4 * 65536;

function readWith(
  file: string,
  options: ColumnOptions,
  chunkBytes: number,
  firstPieceChars: number,
  encoding: PiecesRead['encoding'],
  shared: boolean,
): { read: ColumnResult; bytes: number } {
  const fd = openSync(file, 'r');
  try {
    const buf = Buffer.allocUnsafe(chunkBytes);
    const decoder =
      encoding === 'latin-1' ? null : new TextDecoder(encoding, { fatal: encoding === 'utf-8', ignoreBOM: encoding === 'utf-8' });
    const pieces = new ColumnPieces(options, { shared });
    let pending = '';
    let bytes = 0;
    let first = true;
    const size = fstatSync(fd).size;
    let skip = encoding === 'utf-16le' || encoding === 'utf-16be' ? 2 : 0;
    for (;;) {
      const got = readSync(fd, buf, 0, chunkBytes, null);
      const atEnd = got === 0;
      let chunk = buf.subarray(0, got);
      bytes += got;
      if (skip > 0) {
        const cut = Math.min(skip, chunk.length);
        chunk = chunk.subarray(cut);
        skip -= cut;
      }
      let text: string;
      try {
        text = decoder === null ? chunk.toString('latin1') : decoder.decode(chunk, { stream: !atEnd });
      } catch {
        throw new NotUtf8();
      }
      pending += text;
      // The first piece holds what the whole-text reader looks at before the data (the NUL check and
      // the delimiter guess read up to 64 Ki characters past blank lines), so both decide alike.
      const end = lastRecordEnd(pending, atEnd);
      const take = atEnd ? pending.length : end;
      // It also holds a whole non-blank line (the header), never blank lines alone.
      if (first && !atEnd && (pending.length < firstPieceChars || !/[^\s\uFEFF]/.test(pending.slice(0, take)))) continue;
      if (take > 0 && first) {
        first = false;
        pieces.add(pending.slice(0, take));
        pending = pending.slice(take);
        // Room for the whole file at the first piece's bytes per row (+2 %), read from its size.
        if (pieces.count > 0 && size > bytes) pieces.reserve((pieces.count * size * 1.02) / Math.max(1, bytes - pending.length));
        if (atEnd) break;
        continue;
      }
      if (take > 0) {
        pieces.add(pending.slice(0, take));
        pending = pending.slice(take);
      }
      if (atEnd) break;
    }
    return { read: pieces.finish(), bytes };
  } finally {
    closeSync(fd);
  }
}

/**
 * Read one column of `file` in pieces of `chunkBytes` bytes; the first piece holds at least
 * `firstPieceChars` characters (tests make it small to cut pieces often).
 */
export function readColumnInPieces(
  file: string,
  options: ColumnOptions,
  chunkBytes = 4 * 2 ** 20,
  firstPieceChars = FIRST_PIECE_CHARS,
  /** Values on a SharedArrayBuffer (read by the CLI's second thread without a copy). */
  shared = false,
): PiecesRead {
  const head = Buffer.alloc(2);
  const fd = openSync(file, 'r');
  let got: number;
  try {
    got = readSync(fd, head, 0, 2, 0);
  } finally {
    closeSync(fd);
  }
  const encoding: PiecesRead['encoding'] =
    got === 2 && head[0] === 0xff && head[1] === 0xfe ? 'utf-16le' : got === 2 && head[0] === 0xfe && head[1] === 0xff ? 'utf-16be' : 'utf-8';
  try {
    const r = readWith(file, options, chunkBytes, firstPieceChars, encoding, shared);
    return { ...r, encoding, warnings: [] };
  } catch (e) {
    if (!(e instanceof NotUtf8)) throw e;
    const r = readWith(file, options, chunkBytes, firstPieceChars, 'latin-1', shared);
    return { ...r, encoding: 'latin-1', warnings: ['the file is not valid UTF-8; it was read as Latin-1 (ISO 8859-1)'] };
  }
}

