import { describe, it, expect } from 'vitest';
import { numericColumns, parseCsv } from '../../src/lib/csv';

describe('parseCsv (test logs)', () => {
  it('keeps a quoted comma and a quoted line break inside their field', () => {
    const log = 'time_s,note,temp_C\n0,"start, cold",20\n1,"pump on\nfan off",21\n2,,22\n';
    const t = parseCsv(log);
    expect(t.header).toEqual(['time_s', 'note', 'temp_C']);
    expect(t.rows).toEqual([
      ['0', 'start, cold', '20'],
      ['1', 'pump on\nfan off', '21'],
      ['2', '', '22'],
    ]);
    expect(numericColumns(t)).toEqual([0, 2]);
  });
  it('reads doubled quotes, CRLF lines, a byte-order mark; skips blank and # comment lines', () => {
    const t = parseCsv('\uFEFFa,b\r\n# logger v2\r\n\r\n"say ""hi""", 2 \r\n3,4\r\n');
    expect(t.header).toEqual(['a', 'b']);
    expect(t.rows).toEqual([
      ['say "hi"', '2'],
      ['3', '4'],
    ]);
    expect(t.truncated).toBe(false);
  });
  it('stops after maxRows and says so', () => {
    const t = parseCsv('x,y\n1,2\n3,4\n5,6\n', 2);
    expect(t.rows).toEqual([
      ['1', '2'],
      ['3', '4'],
    ]);
    expect(t.truncated).toBe(true);
    expect(parseCsv('x,y\n1,2\n3,4\n', 2).truncated).toBe(false);
    expect(parseCsv('')).toEqual({ header: [], rows: [], truncated: false });
  });
});
