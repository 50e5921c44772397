// The rollover's confirmation, written as sentences with people's and subsystems' names. Pure, for the island.

export interface RolloverPreviewChange {
  userId: string;
  name: string;
  change: 'to-alumni' | 'continues';
  subsystemNames: string[];
}

/** "A", "A and B", "A, B and C" — British style, no serial comma. */
export function inWords(items: string[]): string {
  if (items.length <= 1) return items[0] ?? '';
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** One sentence per kind of change, each ending with a full stop. */
export function rolloverSentences(from: string, to: string, changes: RolloverPreviewChange[]): string[] {
  const sentences = [`${to} becomes the current season, and ${from} moves into the archive.`];
  const staying = changes.filter((c) => c.change === 'continues');
  const leaving = changes.filter((c) => c.change === 'to-alumni');
  for (const c of staying)
    sentences.push(
      c.subsystemNames.length
        ? `${c.name} continues as a member of ${to} and keeps ${inWords(c.subsystemNames)}.`
        : `${c.name} continues as a member of ${to}.`,
    );
  if (leaving.length)
    sentences.push(
      `${inWords(leaving.map((c) => c.name))} ${leaving.length === 1 ? 'becomes' : 'become'} alumni: they keep reading and answering questions, but stop editing.`,
    );
  if (changes.length === 0) sentences.push(`Nobody’s role changes: ${from} has no members.`);
  sentences.push('Leads and advisors keep their roles.');
  return sentences;
}
