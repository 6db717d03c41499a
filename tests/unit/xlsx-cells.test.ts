import { describe, expect, it } from 'vitest';
import { cellXml, columnLetters, dateSerial, xmlText } from '../../server/services/evidence/xlsx/cell-xml.js';

describe('SpreadsheetML cells', () => {
  it('when columns are numbered, then letters follow the A…Z, AA… scheme (ECMA-376 §18.3.1.4, A1 references)', () => {
    expect([0, 25, 26, 51, 52, 701, 702, 16383].map(columnLetters)).toEqual(['A', 'Z', 'AA', 'AZ', 'BA', 'ZZ', 'AAA', 'XFD']);
  });

  it('when an instant is written as a date, then it is the 1900-system serial (1970-01-01 = 25569, noon = .5)', () => {
    // 25569 for 1970-01-01: the day count Excel shows for =DATE(1970,1,1) (common practice, from memory).
    expect(dateSerial(new Date('1970-01-01T00:00:00Z'))).toBe(25569);
    expect(dateSerial(new Date('1970-01-02T12:00:00Z'))).toBe(25570.5);
  });

  it('when text holds markup, a carriage return or characters XML 1.0 forbids, then each is escaped so it reads back unchanged', () => {
    expect(xmlText('a<b & c>d')).toBe('a&lt;b &amp; c&gt;d');
    expect(xmlText('line\r\nnext\ttab')).toBe('line&#13;\nnext\ttab');
    // ECMA-376 §22.9.2.19 (ST_Xstring): a forbidden character as _xHHHH_, a literal _xHHHH_ with its underscore escaped.
    expect(xmlText('bell\u0007')).toBe('bell_x0007_');
    expect(xmlText('code _x0041_ here')).toBe('code _x005F_x0041_ here');
    expect(xmlText('plain text, ünïcödé 😀')).toBe('plain text, ünïcödé 😀');
  });

  it('when values of each kind are written, then numbers and dates are <v>, text is an inline string, and empty cells are left out', () => {
    expect(cellXml('B2', ' s="5"', 100.125)).toBe('<c r="B2" s="5"><v>100.125</v></c>');
    expect(cellXml('C2', '', '=HYPERLINK("x")')).toBe('<c r="C2" t="inlineStr"><is><t>=HYPERLINK("x")</t></is></c>');
    expect(cellXml('D2', '', ' padded ')).toBe('<c r="D2" t="inlineStr"><is><t xml:space="preserve"> padded </t></is></c>');
    expect(cellXml('E2', '', true)).toBe('<c r="E2" t="b"><v>1</v></c>');
    expect(cellXml('F2', ' s="2"', new Date('1970-01-02T12:00:00Z'))).toBe('<c r="F2" s="2"><v>25570.5</v></c>');
    expect(cellXml('G2', '', null)).toBe('');
    expect(cellXml('H2', '', new Date(Number.NaN))).toBe('');
    expect(cellXml('I2', '', Number.POSITIVE_INFINITY)).toBe('<c r="I2" t="inlineStr"><is><t>Infinity</t></is></c>');
  });
});
