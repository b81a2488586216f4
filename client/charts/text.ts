/**
 * Text sizes for chart layout, estimated from the characters (no measurement, so that jsdom, the
 * browser and the exported report lay out alike), line wrapping on those estimates, and the
 * rounding of coordinates.
 */

/**
 * Width of a text in px, estimated from its characters (no measurement, so that jsdom, the
 * browser and the exported report lay out alike). Deliberately generous, sized on the wide
 * sans-serif faces that `system-ui` falls back to (DejaVu Sans): narrow glyphs 0.36 em, lower case
 * 0.62 em, digits 0.64 em, upper case and symbols 0.76 em, m/w/M/W/% 0.96 em; bold 8 % wider.
 * Common practice, no source.
 */
export function textWidth(text: string, fontSize: number, bold = false): number {
  let em = 0;
  for (const ch of text) {
    if (' .,:;!|\'()[]ijlIft'.includes(ch)) em += 0.36;
    else if ('mwMW%'.includes(ch)) em += 0.96;
    else if (ch >= '0' && ch <= '9') em += 0.64;
    else if (ch >= 'a' && ch <= 'z') em += 0.62;
    else em += 0.76;
  }
  return em * fontSize * (bold ? 1.08 : 1);
}

/** Break a text into lines no wider than maxWidth (by the estimate above), at spaces. */
export function wrapText(text: string, maxWidth: number, fontSize: number, bold = false): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const next = line ? `${line} ${word}` : word;
    if (line && textWidth(next, fontSize, bold) > maxWidth) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/** Round a coordinate to 0.01 px: keeps the SVG small and stable. */
export function round(v: number): number {
  return Math.round(v * 100) / 100;
}
