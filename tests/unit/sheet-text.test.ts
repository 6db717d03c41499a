import { describe, expect, it } from 'vitest';
import { sheetText } from '../../server/services/evidence/workbook/sheet-text.js';

// ECMA-376 Part 1, §22.9.2.19 (ST_Xstring): a reader turns each _xHHHH_ back into the character
// with that UTF-16 code; written here from the standard's text, as the reference decoder.
const readBack = (text: string) => text.replace(/_x([0-9A-Fa-f]{4})_/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));

describe('worksheet text', () => {
  it('when text holds only characters XML 1.0 allows (§2.2 Char), then it is written unchanged', () => {
    for (const text of ['B-1004', 'tab\tand\nline feed', 'ünïcödé 40 °C, 😀', '=HYPERLINK("x")', '_x12_ and x0041_', '']) {
      expect(sheetText(text)).toBe(text);
    }
  });

  it('when text holds C0 controls, DEL, CR or U+FFFE/U+FFFF, then each becomes _xHHHH_', () => {
    expect(sheetText('bell\u0007')).toBe('bell_x0007_');
    expect(sheetText('\u0000\u001F\u007F')).toBe('_x0000__x001F__x007F_');
    expect(sheetText('a\r\nb')).toBe('a_x000D_\nb');
    expect(sheetText('x\uFFFEy\uFFFF')).toBe('x_xFFFE_y_xFFFF_');
  });

  it('when the text itself holds something shaped like an escape, then its underscore is escaped (_x005F_)', () => {
    expect(sheetText('see _x0041_ here')).toBe('see _x005F_x0041_ here');
    expect(sheetText('__x00af_')).toBe('__x005F_x00af_');
  });

  it('when a conforming reader decodes what was written, then it gets the original text back', () => {
    const originals = ['bell\u0007 at 40 °C\r\nsee _x0041_ log\uFFFF', '_x005F_', 'a\u0001b\u0002_x0007_\u001b[0m', 'plain'];
    for (const text of originals) expect(readBack(sheetText(text))).toBe(text);
  });
});
