/**
 * Writes one generated table of the size study into docs/size-study.md, between the markers
 * `<!-- size-study:NAME:begin ... -->` and `<!-- size-study:NAME:end -->` (the rest of the file is
 * written by hand). The scripts call it with `--write`, so the committed table is the one the
 * script printed, never a hand copy.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const SIZE_STUDY_DOC = fileURLToPath(new URL('../docs/size-study.md', import.meta.url));

export function beginMarker(name: string): string {
  return `<!-- size-study:${name}:begin (written by the script; do not edit by hand) -->`;
}

export function endMarker(name: string): string {
  return `<!-- size-study:${name}:end -->`;
}

/** `doc` with the section NAME replaced by `body` (appended at the end when its markers are missing). */
export function replaceSection(doc: string, name: string, body: string): string {
  const begin = beginMarker(name);
  const end = endMarker(name);
  const block = `${begin}\n${body.trimEnd()}\n${end}`;
  const i = doc.indexOf(begin);
  const j = doc.indexOf(end);
  if (i < 0 || j < i) return `${doc.trimEnd()}\n\n${block}\n`;
  return doc.slice(0, i) + block + doc.slice(j + end.length);
}

/** Re-read the doc right before writing (several studies may finish at different times). */
export function writeSection(name: string, body: string, path = SIZE_STUDY_DOC): void {
  writeFileSync(path, replaceSection(readFileSync(path, 'utf8'), name, body));
}

/** The body of section NAME as written (markers excluded); empty when it is missing. */
export function readSection(name: string, path = SIZE_STUDY_DOC): string {
  const doc = readFileSync(path, 'utf8');
  const i = doc.indexOf(beginMarker(name));
  const j = doc.indexOf(endMarker(name));
  if (i < 0 || j < i) return '';
  return doc.slice(i + beginMarker(name).length, j).trim();
}
