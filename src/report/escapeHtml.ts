/**
 * Escaping of text put into HTML or SVG markup. Every piece of user-supplied text (names, ids,
 * captions, labels, table cells) goes through here before it touches markup.
 */

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Text escaped for element content and for double- or single-quoted attribute values
 * (`&`, `<`, `>`, `"`, `'`). Control characters other than tab and newline are dropped, since
 * XML (for the inline SVG) forbids them.
 */
export function escapeHtml(text: string): string {
  // eslint-disable-next-line no-control-regex
  return String(text).replace(/[&<>"']/g, (ch) => ENTITIES[ch] ?? ch).replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, '');
}
