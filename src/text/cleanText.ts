/**
 * Names and texts from input files, cleaned in one place: control characters (C0 U+0000–U+001F,
 * DEL U+007F, C1 U+0080–U+009F) and the invisible direction controls of Unicode's bidirectional
 * algorithm (UAX #9: U+200E/U+200F marks, U+061C, the embeddings and overrides U+202A–U+202E and
 * the isolates U+2066–U+2069) are removed, so that a name cannot hide or reorder text in a table,
 * a terminal or the report. A tab or line break inside a name becomes one space.
 */

const DIRECTION_CONTROLS = /[\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/g;
const LINE_BREAKS_AND_TABS = /[\t\n\r\v\f]+/g;
// eslint-disable-next-line no-control-regex
const CONTROLS = /[\u0000-\u001F\u007F-\u009F]/g;
/** Any character the three replacements below would touch (tabs and line breaks are C0 controls). */
// eslint-disable-next-line no-control-regex
const ANY_HIDDEN = /[\u0000-\u001F\u007F-\u009F\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/;

/** `text` without control and direction-override characters (tabs and line breaks become a space). */
export function cleanName(text: string): string {
  if (!ANY_HIDDEN.test(text)) return text; // the usual case: one scan, no copies
  return text.replace(DIRECTION_CONTROLS, '').replace(LINE_BREAKS_AND_TABS, ' ').replace(CONTROLS, '');
}

/** True when `cleanName` would change `text`. */
export function hasHiddenCharacters(text: string): boolean {
  return cleanName(text) !== text;
}
