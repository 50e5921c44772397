/** A small CSV reader for test logs: a header row, comma-separated, optional double quotes. Pure. */
export interface CsvTable {
  header: string[];
  rows: string[][];
  truncated: boolean;
}

export function parseCsv(text: string, maxRows = Infinity): CsvTable {
  const lines = text
    .replace(/^\uFEFF/, '')
    .split(/\r?\n/)
    .filter((l) => l.trim() !== '' && !l.startsWith('#'));
  const split = (line: string): string[] => {
    const out: string[] = [];
    let cur = '';
    let quoted = false;
    for (let i = 0; i < line.length; i++) {
      const ch = line[i];
      if (quoted) {
        if (ch === '"' && line[i + 1] === '"') {
          cur += '"';
          i++;
        } else if (ch === '"') quoted = false;
        else cur += ch;
      } else if (ch === '"') quoted = true;
      else if (ch === ',') {
        out.push(cur.trim());
        cur = '';
      } else cur += ch;
    }
    out.push(cur.trim());
    return out;
  };
  const header = lines.length ? split(lines[0]) : [];
  const body = lines.slice(1);
  return { header, rows: body.slice(0, maxRows).map(split), truncated: body.length > maxRows };
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
