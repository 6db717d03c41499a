// SpreadsheetML cells as XML text (ECMA-376 Part 1, §18.3.1.4 c, §18.18.11 ST_CellType).
// Text goes in as an inline string (t="inlineStr"): shown as text, never run as a formula.

export type CellValue = string | number | boolean | Date | null;

/** Column letters: 0 → A, 25 → Z, 26 → AA. */
export function columnLetters(index: number): string {
  let n = index + 1;
  let letters = '';
  while (n > 0) {
    const digit = (n - 1) % 26;
    letters = String.fromCharCode(65 + digit) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

const msPerDay = 86_400_000;
/** Days from the 1900 date system's day 0 (1899-12-30, counting Excel's 1900 leap day) to 1970-01-01. */
const unixEpochSerial = 25_569;

/** A spreadsheet date serial (1900 date system, ECMA-376 §18.17.4.1) for an instant, in UTC. */
export function dateSerial(date: Date): number {
  return unixEpochSerial + date.getTime() / msPerDay;
}

// Characters XML 1.0 cannot carry are written as _xHHHH_ (ECMA-376 §22.9.2.19 ST_Xstring), and a
// literal "_xHHHH_" gets its underscore escaped the same way, so every text reads back unchanged.
// A carriage return becomes &#13; because XML parsers turn a raw one into a line feed.
// eslint-disable-next-line no-control-regex -- finding the control characters XML forbids is the point
const needsEscape = /[&<>\r\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|_x[0-9A-Fa-f]{4}_/;
// eslint-disable-next-line no-control-regex -- as above
const escapes = /[&<>\r\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]|_(?=x[0-9A-Fa-f]{4}_)/g;

function escapeOne(ch: string): string {
  switch (ch) {
    case '&': return '&amp;';
    case '<': return '&lt;';
    case '>': return '&gt;';
    case '\r': return '&#13;';
    default: return `_x${ch.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}_`;
  }
}

export function xmlText(text: string): string {
  return needsEscape.test(text) ? text.replace(escapes, escapeOne) : text;
}

export function inlineString(text: string): string {
  const escaped = xmlText(text);
  // Leading or trailing white space survives only with xml:space="preserve".
  const padded = text.length > 0 && (text.charCodeAt(0) <= 32 || text.charCodeAt(text.length - 1) <= 32);
  return padded ? `<is><t xml:space="preserve">${escaped}</t></is>` : `<is><t>${escaped}</t></is>`;
}

/**
 * One cell: `ref` is its address (B7), `style` its ` s="n"` attribute or ''. A null, or a date
 * that is not a valid instant, is an empty cell and is left out.
 */
export function cellXml(ref: string, style: string, value: CellValue): string {
  if (value === null) return '';
  switch (typeof value) {
    case 'number':
      return Number.isFinite(value) ? `<c r="${ref}"${style}><v>${value}</v></c>` : `<c r="${ref}"${style} t="inlineStr">${inlineString(String(value))}</c>`;
    case 'string':
      return `<c r="${ref}"${style} t="inlineStr">${inlineString(value)}</c>`;
    case 'boolean':
      return `<c r="${ref}"${style} t="b"><v>${value ? 1 : 0}</v></c>`;
    default:
      return Number.isNaN(value.getTime()) ? '' : `<c r="${ref}"${style}><v>${dateSerial(value)}</v></c>`;
  }
}
