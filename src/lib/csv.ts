// Test logs read with papaparse: a header row, comma-separated, RFC 4180 quoting (a quoted field may hold commas,
// doubled quotes and line breaks). Blank lines and lines starting with "#" (logger notes) are skipped. Pure.
import Papa from 'papaparse';

export interface CsvTable {
  header: string[];
  rows: string[][];
  truncated: boolean;
}

export function parseCsv(text: string, maxRows = Infinity): CsvTable {
  const limited = Number.isFinite(maxRows);
  const { data } = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), {
    delimiter: ',',
    comments: '#',
    skipEmptyLines: 'greedy',
    transform: (cell) => cell.trim(),
    // The header, the rows wanted and one more, to tell whether there were more.
    preview: limited ? maxRows + 2 : 0,
  });
  const [header = [], ...body] = data;
  return { header, rows: limited ? body.slice(0, maxRows) : body, truncated: body.length > maxRows };
}

/** Indexes of columns whose every non-empty cell is a number. */
export function numericColumns(t: CsvTable): number[] {
  return t.header
    .map((_, i) => i)
    .filter(
      (i) =>
        t.rows.length > 0 && t.rows.every((r) => r[i] === undefined || r[i] === '' || Number.isFinite(Number(r[i]))),
    );
}
