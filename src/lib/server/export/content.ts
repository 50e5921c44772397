// What goes into the handover bundle, as plain strings and JSON: one function per kind of file, no zip here.
import { stringify } from 'yaml';
import { asc, eq, isNull } from 'drizzle-orm';
import { db } from '../db/client';
import { calculations, records, seasons, subsystems } from '../db/schema';
import { getRecordView, type RecordRef, type RecordView } from '../records/view';
import { listComments } from '../questions';
import { getCalculation } from '../calculations';
import { listPeople } from '../people';
import { docToMarkdown, escapeText as md } from './markdown';
import { attachmentIdOf } from '../../editor/links';
import { nameForType, recordBase, safeFileName, slugify } from './names';

export interface RecordEntry {
  id: string;
  title: string;
  kind: string;
  status: string;
  season: string;
  seasonStarts: string;
  subsystem: string;
  subsystemName: string;
  path: string;
}

export interface CalculationEntry {
  id: string;
  title: string;
  kind: string;
  season: string;
  subsystem: string;
  path: string;
}

/** Every live record, oldest season first, for the index and the per-record files. */
export function recordEntries(): RecordEntry[] {
  return db()
    .select({
      id: records.id,
      title: records.title,
      kind: records.kind,
      status: records.status,
      season: seasons.name,
      seasonStarts: seasons.startsOn,
      subsystem: records.subsystemSlug,
      subsystemName: subsystems.name,
    })
    .from(records)
    .innerJoin(seasons, eq(seasons.id, records.seasonId))
    .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
    .where(isNull(records.deletedAt))
    .orderBy(asc(seasons.startsOn), asc(subsystems.position), asc(records.createdAt), asc(records.id))
    .all()
    .map((r) => ({ ...r, path: `records/${recordBase(r)}.md` }));
}

export function calculationEntries(): CalculationEntry[] {
  return db()
    .select({
      id: calculations.id,
      title: calculations.title,
      kind: calculations.kind,
      season: seasons.name,
      subsystem: calculations.subsystemSlug,
    })
    .from(calculations)
    .innerJoin(seasons, eq(seasons.id, calculations.seasonId))
    .where(isNull(calculations.deletedAt))
    .orderBy(asc(seasons.startsOn), asc(calculations.subsystemSlug), asc(calculations.title))
    .all()
    .map((c) => ({ ...c, path: `calculations/${slugify(c.title)}-${c.id}.json` }));
}

export function attachmentFolder(r: { id: string; title: string }): string {
  return `attachments/${recordBase(r)}`;
}

/**
 * Attachment names within one record folder: extension from the sniffed type (see `nameForType`), made unique
 * ("photo.jpg", "photo-2.jpg").
 */
export function attachmentNames(files: { id: string; fileName: string; contentType: string }[]): Map<string, string> {
  const used = new Set<string>();
  const out = new Map<string, string>();
  for (const f of files) {
    const safe = safeFileName(nameForType(f.fileName, f.contentType));
    let name = safe;
    for (let i = 2; used.has(name.toLowerCase()); i++) name = safe.replace(/(\.[^.]*)?$/, (ext) => `-${i}${ext}`);
    used.add(name.toLowerCase());
    out.set(f.id, name);
  }
  return out;
}

const relLink = (paths: Map<string, string>, ref: RecordRef) => {
  const p = paths.get(ref.id);
  return p ? `[${md(ref.title)}](../${p})` : md(ref.title);
};

/** One record as Markdown: YAML front matter, the body converted from the editor document, links, files, Q&A. */
export function recordMarkdown(id: string, paths: Map<string, string>, calcPaths: Map<string, string>): string | null {
  const r: RecordView | null = getRecordView(id);
  if (!r) return null;
  const front = {
    id: r.id,
    title: r.title,
    kind: r.kind,
    status: r.status,
    ...(r.source ? { source: r.source } : {}),
    season: r.season,
    subsystem: r.subsystem,
    author: r.author?.name ?? null,
    created: r.createdAt,
    updated: r.updatedAt,
    version: r.version,
    reviewed: r.reviewed ? { by: r.reviewed.by, at: r.reviewed.at, version: r.reviewed.version } : null,
    calculations: r.calculations.map((c) => c.id),
    related: r.related.map((x) => x.id),
    supersedes: r.supersedes.map((x) => x.id),
    supersededBy: r.supersededBy.map((x) => x.id),
  };
  // Links between records and to calculations point into the bundle, so they work with no server.
  const href = (h: string) => {
    const m = /^\/(records|calculations)\/([A-Za-z0-9_-]+)$/.exec(h);
    const target = m ? (m[1] === 'records' ? paths : calcPaths).get(m[2]) : undefined;
    return target ? `../${target}` : h;
  };
  const names = attachmentNames(r.attachments);
  // Images in the text show the record's own attachment files, which sit in its folder of the bundle.
  const src = (s: string) => {
    const id = attachmentIdOf(s);
    const name = id ? names.get(id) : undefined;
    return name ? `../${attachmentFolder(r)}/${encodeURI(name)}` : s;
  };
  const lines: string[] = [
    '---',
    stringify(front).trimEnd(),
    '---',
    '',
    `# ${md(r.title)}`,
    '',
    docToMarkdown(r.body, { href, src }).trimEnd(),
  ];
  const links: string[] = [];
  for (const x of r.supersedes) links.push(`- Supersedes: ${relLink(paths, x)} (${x.season})`);
  for (const x of r.supersededBy) links.push(`- Superseded by: ${relLink(paths, x)} (${x.season})`);
  for (const x of r.related) links.push(`- Related: ${relLink(paths, x)} (${x.season})`);
  for (const c of r.calculations) {
    const p = calcPaths.get(c.id);
    links.push(`- Calculation: ${p ? `[${md(c.title)}](../${p})` : md(c.title)}`);
  }
  if (links.length) lines.push('', '## Links', '', ...links);
  if (r.attachments.length) {
    lines.push('', '## Attachments', '');
    for (const a of r.attachments) {
      const name = names.get(a.id)!;
      lines.push(`- [${name}](../${attachmentFolder(r)}/${encodeURI(name)}) (${a.contentType}, ${a.size} bytes)`);
    }
  }
  const qa = listComments(r.id);
  if (qa.length) {
    lines.push('', '## Questions and answers', '');
    for (const c of qa)
      lines.push(
        `- **${md(c.author)}**, ${c.createdAt.slice(0, 10)}${c.parentId ? ' (answer)' : c.kind === 'question' ? (c.answeredAt ? ' (question, answered)' : ' (question)') : ''}: ${md(c.body.replace(/\n+/g, ' '))}`,
      );
  }
  return lines.join('\n') + '\n';
}

/** A saved calculation as JSON: inputs, the latest outputs with their engine version, and every earlier result. */
export function calculationJson(id: string): string | null {
  const c = getCalculation(id);
  if (!c) return null;
  const data = {
    id: c.id,
    kind: c.kind,
    kindTitle: c.kindTitle,
    title: c.title,
    subsystem: c.subsystem,
    season: c.season,
    author: c.author,
    notes: c.notes,
    created: c.createdAt,
    inputs: c.inputs,
    latest: { engineVersion: c.engineVersion, computedAt: c.computedAt, outputs: c.outputs, warnings: c.warnings },
    currentEngineVersion: c.currentEngineVersion,
    results: c.results,
    records: c.records.map((r) => r.id),
  };
  return JSON.stringify(data, null, 2) + '\n';
}

export interface GuideFile {
  path: string;
  title: string;
  subsystem: string;
  content: string;
}

/** The people directory by season, so the next cohort knows whom to ask (names and roles, no addresses). */
export function peopleMarkdown(): string {
  const lines = ['## People by season', ''];
  const bySeason = new Map<string, string[]>();
  for (const p of listPeople()) {
    for (const s of p.seasons) {
      const owns = s.subsystems.map((x) => x.name).join(', ');
      bySeason.set(s.season, [...(bySeason.get(s.season) ?? []), `- ${p.name}: ${s.role}${owns ? `, ${owns}` : ''}`]);
    }
  }
  for (const [season, people] of [...bySeason].sort((a, b) => b[0].localeCompare(a[0])))
    lines.push(`### ${season}`, '', ...people, '');
  return lines.join('\n');
}

export function indexMarkdown(p: {
  exportedAt: Date;
  records: RecordEntry[];
  calculations: CalculationEntry[];
  guides: GuideFile[];
  attachmentCount: number;
}): string {
  const lines: string[] = [
    '# Wakebook handover bundle',
    '',
    `Exported ${p.exportedAt.toISOString().replace('T', ' ').slice(0, 16)} UTC: ${p.records.length} records, ${p.guides.length} guides, ${p.calculations.length} saved calculations, ${p.attachmentCount} attachments.`,
    '',
    'Everything here reads without a server: records and guides are Markdown files (any text editor shows them),',
    'calculations are JSON, attachments sit in a folder per record. Open `index.html` in a browser for clickable links.',
    '',
    '## Records',
    '',
  ];
  const seasonsSeen = [...new Map(p.records.map((r) => [r.season, r.seasonStarts])).entries()].sort((a, b) =>
    b[1].localeCompare(a[1]),
  );
  for (const [season] of seasonsSeen) {
    lines.push(`### Season ${season}`, '');
    for (const r of p.records.filter((x) => x.season === season)) {
      lines.push(`- ${r.subsystemName}: [${md(r.title)}](${r.path}) (${r.kind}, ${r.status})`);
    }
    lines.push('');
  }
  if (p.records.length === 0) lines.push('No records yet.', '');
  lines.push('## Guides', '');
  for (const g of p.guides) lines.push(`- ${g.subsystem}: [${md(g.title)}](${g.path})`);
  if (p.guides.length === 0) lines.push('No guides.');
  lines.push('', '## Saved calculations', '');
  for (const c of p.calculations) lines.push(`- ${c.season}, ${c.subsystem}: [${md(c.title)}](${c.path}) (${c.kind})`);
  if (p.calculations.length === 0) lines.push('No saved calculations.');
  lines.push('', peopleMarkdown());
  return lines.join('\n') + '\n';
}
