/**
 * Escaping for user text (column names, file names, units, cell values) placed in HTML or
 * in an HTML attribute. The page itself sets text through `textContent`; this is for the
 * exported report, which is built as a string.
 * OWASP XSS Prevention Cheat Sheet, rule #1 (HTML entity encoding of & < > " ').
 */
const ENTITIES: Readonly<Record<string, string>> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

export function escapeHtml(text: unknown): string {
  return String(text ?? '').replace(/[&<>"']/g, (c) => ENTITIES[c] ?? c);
}
