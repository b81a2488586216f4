/**
 * Reading the input file into a string for the (pure) CSV reader: UTF-8 by default, UTF-16 when
 * the file starts with its byte-order mark, Latin-1 (with a warning) when the bytes are not valid
 * UTF-8. File-system failures become one clear InputError. Standard input and devices are read
 * in chunks up to STREAM_INPUT_MAX_BYTES.
 */
import { closeSync, fstatSync, openSync, readFileSync, readSync } from 'node:fs';
import { InputError } from '../core/index.js';

export interface InputText {
  readonly text: string;
  readonly bytes: number;
  readonly encoding: 'utf-8' | 'utf-16le' | 'utf-16be' | 'latin-1';
  readonly warnings: readonly string[];
}

/** Node's largest string, in UTF-16 code units (V8 on 64-bit). */
const MAX_STRING = 0x1fffffe8;

function describeFsError(file: string, e: unknown): InputError {
  const code = (e as { code?: string }).code;
  const why =
    code === 'ENOENT'
      ? 'no such file'
      : code === 'EISDIR'
        ? 'it is a folder, not a file'
        : code === 'EACCES' || code === 'EPERM'
          ? 'permission denied'
          : (e as Error).message;
  return new InputError(`cannot read ${JSON.stringify(file)}: ${why}`, {}, 'bad-input');
}

/**
 * The most read from standard input or a device (a pipe, /dev/zero, a FIFO): such a source has no
 * size to check first and may never end. 256 MiB is half the largest text one JavaScript string
 * holds (so any encoding fits) and five times the server's body limit; a larger file should be
 * given by name (regular files of any size are read in pieces).
 */
export const STREAM_INPUT_MAX_BYTES = 256 * 2 ** 20;

/** Bytes read per call from a stream source. */
const STREAM_CHUNK = 1 << 20;

function sleepSync(ms: number): void {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}

/** Read a source that has no size (stdin, a device) in chunks, refusing it past `max` bytes. */
function readStream(fd: number, label: string, max: number): Buffer {
  const chunks: Buffer[] = [];
  let total = 0;
  for (;;) {
    const buf = Buffer.allocUnsafe(STREAM_CHUNK);
    let got: number;
    try {
      got = readSync(fd, buf, 0, STREAM_CHUNK, null);
    } catch (e) {
      const code = (e as { code?: string }).code;
      if (code === 'EAGAIN') {
        sleepSync(5); // a non-blocking pipe with nothing yet to read
        continue;
      }
      if (code === 'EOF') break;
      throw e;
    }
    if (got === 0) break;
    total += got;
    if (total > max) {
      throw new InputError(
        `${label} is larger than ${max / 2 ** 20} MiB, the most read from standard input or a device; save the data to a file and give its name (files of any size are read in pieces)`,
        {},
        'bad-input',
      );
    }
    chunks.push(got === STREAM_CHUNK ? buf : buf.subarray(0, got));
  }
  return Buffer.concat(chunks, total);
}

/** The whole input: a regular file at once, standard input or a device in chunks up to the cap. */
function readBytes(file: string, maxStreamBytes: number): Buffer {
  const label = file === '-' ? 'standard input' : JSON.stringify(file);
  let fd: number;
  let own = false;
  try {
    if (file === '-') fd = 0;
    else {
      fd = openSync(file, 'r');
      own = true;
    }
  } catch (e) {
    throw describeFsError(file, e);
  }
  try {
    const st = fstatSync(fd);
    if (st.isDirectory()) throw describeFsError(file, Object.assign(new Error('folder'), { code: 'EISDIR' }));
    if (st.isFile()) return readFileSync(fd);
    return readStream(fd, label, maxStreamBytes);
  } catch (e) {
    if (e instanceof InputError) throw e;
    throw describeFsError(file === '-' ? 'standard input' : file, e);
  } finally {
    if (own) closeSync(fd);
  }
}

export function readInputText(file: string, opts: { readonly maxStreamBytes?: number } = {}): InputText {
  const buf = readBytes(file, opts.maxStreamBytes ?? STREAM_INPUT_MAX_BYTES);
  const warnings: string[] = [];
  if (buf.length >= 2 && buf[0] === 0xff && buf[1] === 0xfe) {
    return { text: buf.subarray(2).toString('utf16le'), bytes: buf.length, encoding: 'utf-16le', warnings };
  }
  if (buf.length >= 2 && buf[0] === 0xfe && buf[1] === 0xff) {
    const body = Buffer.from(buf.subarray(2));
    body.swap16();
    return { text: body.toString('utf16le'), bytes: buf.length, encoding: 'utf-16be', warnings };
  }
  if (buf.length > MAX_STRING) {
    throw new InputError(
      `${JSON.stringify(file)} is too large to read at once (${(buf.length / 2 ** 20).toFixed(0)} MiB; the limit is ${(MAX_STRING / 2 ** 20).toFixed(0)} MiB)`,
      {},
      'bad-input',
    );
  }
  let text = buf.toString('utf8');
  if (text.includes('\uFFFD') && !buf.includes(Buffer.from([0xef, 0xbf, 0xbd]))) {
    // Not valid UTF-8 and no genuine U+FFFD in the file: read the bytes as Latin-1 instead.
    text = buf.toString('latin1');
    warnings.push('the file is not valid UTF-8; it was read as Latin-1 (ISO 8859-1)');
    return { text, bytes: buf.length, encoding: 'latin-1', warnings };
  }
  return { text, bytes: buf.length, encoding: 'utf-8', warnings };
}
