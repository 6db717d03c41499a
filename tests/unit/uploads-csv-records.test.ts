import { describe, expect, it } from 'vitest';
import { csvRecords, CsvSyntaxError } from '../../server/services/uploads/csv-records.js';
import { readNumber } from '../../server/services/uploads/upload-options.js';
import { uploadRunId } from '../../server/services/uploads/run-key.js';

const read = (text: string, delimiter = ',') => [...csvRecords(text, delimiter)];

describe('RFC 4180 CSV records', () => {
  it('when fields are quoted with doubled quotes, delimiters and line breaks inside, then each is read whole and records are numbered', () => {
    expect(read('a;b\r\n"x;y";"say ""hi"""\r\n"two\r\nlines";\r\n', ';')).toEqual([
      { row: 1, cells: ['a', 'b'] },
      { row: 2, cells: ['x;y', 'say "hi"'] },
      { row: 3, cells: ['two\r\nlines', ''] },
    ]);
  });

  it('when lines end in LF, a BOM leads and a blank line sits between, then the BOM is dropped and the blank line only counted', () => {
    expect(read('\uFEFFserial\tvalue\n\nFT1\t0,5\n', '\t')).toEqual([{ row: 1, cells: ['serial', 'value'] }, { row: 3, cells: ['FT1', '0,5'] }]);
  });

  it('when the last record has no line break, then it is still read', () => {
    expect(read('a,b\n1,2')).toEqual([{ row: 1, cells: ['a', 'b'] }, { row: 2, cells: ['1', '2'] }]);
  });

  it('when a quote is never closed, stray or followed by text, then the error names row and column', () => {
    const fault = (text: string) => { try { read(text); } catch (e) { return e instanceof CsvSyntaxError ? [e.row, e.column, e.detail] : e; } return 'no error'; };
    expect(fault('a,b\n1,"open\n')).toEqual([2, 2, 'a quoted field is never closed']);
    expect(fault('a,b\n1,x"y\n')).toEqual([2, 2, expect.stringContaining('a quote inside a field')]);
    expect(fault('a,b\n"1"x,2\n')).toEqual([2, 1, expect.stringContaining("unexpected character 'x' after a closing quote")]);
  });
});

describe('numbers written as text', () => {
  it.each([
    ['0,123', ',', 0.123], ['-1,5e3', ',', -1500], ['12.75', '.', 12.75], [' 7 ', '.', 7], [',5', ',', 0.5],
  ])('when %s is read with decimal %s, then it is %d', (text, decimal, value) => {
    expect(readNumber(text, decimal as '.' | ',')).toEqual({ value });
  });

  it.each([['12,3,4', ','], ['1.234,5', ','], ['0,5', '.'], ['1 000', '.'], ['12 V', '.'], ['', '.'], ['NaN', '.']])('when %s is read with decimal %s, then it is refused', (text, decimal) => {
    expect(readNumber(text, decimal as '.' | ',')).toHaveProperty('problem');
  });
});

describe('runIds of uploaded runs', () => {
  it('when the same start is written with another offset, then the runId is the same, and another station gives another one', () => {
    const a = uploadRunId('FT000001', '2026-11-30T08:15:00+01:00', 'EOL-1');
    expect(uploadRunId(' FT000001 ', '2026-11-30T07:15:00Z', 'EOL-1')).toBe(a);
    expect(uploadRunId('FT000001', '2026-11-30T08:15:00+01:00', 'EOL-2')).not.toBe(a);
    expect(a).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-5[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  });
});
