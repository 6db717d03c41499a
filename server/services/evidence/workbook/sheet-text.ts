// Characters a worksheet cannot carry as they are. XML 1.0 (§2.2, Char) has no place for the C0
// controls other than tab, LF and CR, nor for U+FFFE and U+FFFF; a CR in text comes back as LF
// (§2.11, end-of-line handling). exceljs 4 drops the C0 controls and DEL without a trace and
// writes U+FFFE/U+FFFF as they are, which leaves a file that readers refuse or cut short.
// eslint-disable-next-line no-control-regex -- finding control characters is this pattern's job
const unsafe = /[\u0000-\u0008\u000B-\u001F\u007F\uFFFE\uFFFF]|_(?=x[0-9A-Fa-f]{4}_)/;
const unsafeAll = new RegExp(unsafe.source, 'g');

const escape = (char: string) => `_x${char.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}_`;

/**
 * Text as a worksheet cell holds it: each character above as the escape ECMA-376 defines for it,
 * `_xHHHH_` (Part 1, §22.9.2.19 ST_Xstring), which Excel reads back as the character and other
 * programs show as written, so nothing is lost unseen. An underscore that would start such an
 * escape in the text itself becomes `_x005F_`, so the text is never read as an escape.
 * The pack's CSV keeps every text exactly as stored.
 */
export function sheetText(text: string): string {
  return unsafe.test(text) ? text.replace(unsafeAll, escape) : text;
}
