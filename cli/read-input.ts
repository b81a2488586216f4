/**
 * Reading the input file into a string for the (pure) CSV reader: UTF-8 by default, UTF-16 when
 * the file starts with its byte-order mark, Latin-1 (with a warning) when the bytes are not valid
 * UTF-8. File-system failures become one clear InputError.
 */
import { readFileSync } from 'node:fs';
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

export function readInputText(file: string): InputText {
  let buf: Buffer;
  try {
    buf = readFileSync(file === '-' ? 0 : file);
  } catch (e) {
    throw describeFsError(file === '-' ? 'standard input' : file, e);
  }
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
