// Splits text into the same terms SQLite's FTS5 `unicode61 remove_diacritics 2` tokenizer makes: letters, digits and
// private-use characters are kept, everything else separates; case and diacritics are folded. The vocabulary and the
// query parser use this so a term we look up is the term FTS5 stored.

const TOKEN = /[\p{L}\p{N}\p{Co}]+/gu;
const MARKS = /\p{M}+/gu;

const ASCII = /^[\u0000-\u007f]*$/;

/** Lower-cased, diacritics removed ("Naïve Café" → "naive cafe"). */
export function foldCase(text: string): string {
  // Plain ASCII has no marks and nothing to compose: lower-casing is all.
  if (ASCII.test(text)) return text.toLowerCase();
  return text.normalize('NFD').replace(MARKS, '').toLowerCase().normalize('NFC');
}

export function tokenize(text: string): string[] {
  return foldCase(text).match(TOKEN) ?? [];
}

/** The distinct terms of a text, for the vocabulary. */
export function distinctTerms(text: string, maxLength = 64): Set<string> {
  const out = new Set<string>();
  for (const t of tokenize(text)) if (t.length <= maxLength) out.add(t);
  return out;
}
