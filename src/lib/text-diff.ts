/** Line-level difference of two texts (longest common subsequence). Pure; fine for records of a few hundred lines. */
export type DiffLine = { kind: 'same' | 'added' | 'removed'; text: string };

export function diffLines(a: string, b: string): DiffLine[] {
  const x = a.split('\n');
  const y = b.split('\n');
  const n = x.length;
  const m = y.length;
  // lcs[i][j] = length of the LCS of x[i..] and y[j..]
  const lcs: Uint32Array[] = Array.from({ length: n + 1 }, () => new Uint32Array(m + 1));
  for (let i = n - 1; i >= 0; i--)
    for (let j = m - 1; j >= 0; j--)
      lcs[i][j] = x[i] === y[j] ? lcs[i + 1][j + 1] + 1 : Math.max(lcs[i + 1][j], lcs[i][j + 1]);
  const out: DiffLine[] = [];
  let i = 0;
  let j = 0;
  while (i < n && j < m) {
    if (x[i] === y[j]) {
      out.push({ kind: 'same', text: x[i] });
      i++;
      j++;
    } else if (lcs[i + 1][j] >= lcs[i][j + 1]) out.push({ kind: 'removed', text: x[i++] });
    else out.push({ kind: 'added', text: y[j++] });
  }
  while (i < n) out.push({ kind: 'removed', text: x[i++] });
  while (j < m) out.push({ kind: 'added', text: y[j++] });
  return out;
}
