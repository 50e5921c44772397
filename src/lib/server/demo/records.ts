import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { parse as parseYaml } from 'yaml';
import { z } from 'zod';
import { attachments, comments, recordCalculations, recordLinks, recordRevisions, records } from '../db/schema';
import { COMMENT_KINDS, LESSON_SOURCES, RECORD_KINDS, RECORD_STATUSES } from '../../domain';
import { newId } from '../ids';
import { processBody } from '../records/body';
import { sniffType } from '../filetype';
import { storeBytes } from '../storage';
import { markdownToDoc } from './markdown';
import type { SeedIds, Tx } from './seed-types';

const dateish = z.union([z.date(), z.string()]).transform((v) => (v instanceof Date ? v : new Date(v)));

const frontSchema = z.object({
  id: z.string().regex(/^demo-rec-[a-z0-9-]+$/),
  kind: z.enum(RECORD_KINDS),
  title: z.string(),
  subsystem: z.string(),
  season: z.string(),
  status: z.enum(RECORD_STATUSES),
  author: z.email(),
  createdAt: dateish,
  source: z.enum(LESSON_SOURCES).optional(),
  calculations: z.array(z.string()).default([]),
  related: z.array(z.string()).default([]),
  supersedes: z.string().optional(),
  reviewedBy: z.email().optional(),
  reviewedOn: dateish.optional(),
  attachments: z.array(z.string()).default([]),
  /** The status of the first version when later versions changed it (default: the record's status). */
  firstStatus: z.enum(RECORD_STATUSES).optional(),
  /**
   * Versions after the first, oldest first. The file's text is the newest; each version says what it changed
   * (`was` → `now`), so the earlier texts are the file's text with those changes undone, newest first.
   */
  versions: z
    .array(
      z.object({
        at: dateish,
        author: z.email(),
        note: z.string().optional(),
        status: z.enum(RECORD_STATUSES).optional(),
        changes: z.array(z.object({ was: z.string(), now: z.string() })).default([]),
      }),
    )
    .default([]),
  comments: z
    .array(
      z.object({
        /** A name for this comment inside the file, so an answer can say which question it answers. */
        key: z.string().optional(),
        author: z.email(),
        at: dateish,
        body: z.string(),
        kind: z.enum(COMMENT_KINDS).default('note'),
        replyTo: z.string().optional(),
        answeredBy: z.email().optional(),
        answeredOn: dateish.optional(),
      }),
    )
    .default([]),
});

export type DemoRecord = z.infer<typeof frontSchema> & { markdown: string };

export function loadDemoRecords(dir: string): DemoRecord[] {
  const folder = resolve(dir, 'records');
  if (!existsSync(folder)) return [];
  return readdirSync(folder)
    .filter((f) => f.endsWith('.md'))
    .sort()
    .map((f) => {
      const text = readFileSync(resolve(folder, f), 'utf8');
      const m = /^---\n([\s\S]*?)\n---\n([\s\S]*)$/.exec(text);
      if (!m) throw new Error(`demo record ${f}: no front matter`);
      return { ...frontSchema.parse(parseYaml(m[1])), markdown: m[2] };
    });
}

interface DemoVersion {
  version: number;
  at: Date;
  author: string;
  note: string;
  status: DemoRecord['status'];
  markdown: string;
}

/** Every version of a demo record, oldest first, each with its full text (see `versions` in the front matter). */
function demoVersions(r: DemoRecord): DemoVersion[] {
  const texts = [r.markdown];
  for (const v of [...r.versions].reverse()) {
    let text = texts[0];
    for (const c of v.changes) {
      if (text.split(c.now).length !== 2) throw new Error(`demo record ${r.id}: “${c.now}” is not in the text once`);
      text = text.replace(c.now, () => c.was);
    }
    texts.unshift(text);
  }
  let status = r.firstStatus ?? r.status;
  const out: DemoVersion[] = [
    { version: 1, at: r.createdAt, author: r.author, note: 'Created', status, markdown: texts[0] },
  ];
  r.versions.forEach((v, i) => {
    const before = status;
    status = v.status ?? status;
    out.push({
      version: i + 2,
      at: v.at,
      author: v.author,
      note: v.note ?? (before !== status ? `Status: ${before} → ${status}` : ''),
      status,
      markdown: texts[i + 1],
    });
  });
  if (status !== r.status) throw new Error(`demo record ${r.id}: its versions end as ${status}, not ${r.status}`);
  return out;
}

/** Demo prose names other records and calculations by id; in the app they become links with their titles. */
function linkMentions(markdown: string, titles: Map<string, { title: string; url: string }>): string {
  return markdown.replace(/\b(demo-(?:rec|calc)-[a-z0-9-]*[a-z0-9])\b/g, (id) => {
    const t = titles.get(id);
    return t ? `[${t.title.replace(/[[\]]/g, '')}](${t.url})` : id;
  });
}

function plainMentions(text: string, titles: Map<string, { title: string }>): string {
  return text.replace(/\b(demo-(?:rec|calc)-[a-z0-9-]*[a-z0-9])\b/g, (id) =>
    titles.has(id) ? `“${titles.get(id)!.title}”` : id,
  );
}

interface DemoAttachment {
  bytes: Uint8Array;
  contentType: string;
}

/** Reads and sniffs every demo attachment up front: sniffing is asynchronous, the seeding transaction is not. */
export async function loadDemoAttachments(dir: string, list: DemoRecord[]): Promise<Map<string, DemoAttachment>> {
  const out = new Map<string, DemoAttachment>();
  for (const name of new Set(list.flatMap((r) => r.attachments))) {
    const bytes = new Uint8Array(readFileSync(resolve(dir, 'attachments', name)));
    const type = await sniffType(bytes, name);
    if (!type) throw new Error(`demo attachment ${name}: type not allowed`);
    out.set(name, { bytes, contentType: type.contentType });
  }
  return out;
}

export function seedRecords(
  tx: Tx,
  ids: SeedIds,
  files: Map<string, DemoAttachment>,
  list: DemoRecord[],
  calcTitles: Map<string, string>,
): void {
  const titles = new Map<string, { title: string; url: string }>();
  for (const r of list) titles.set(r.id, { title: r.title, url: `/records/${r.id}` });
  for (const [id, title] of calcTitles) titles.set(id, { title, url: `/calculations/${id}` });
  const user = (email: string) => {
    const id = ids.userIdByEmail.get(email);
    if (!id) throw new Error(`demo record: unknown person ${email}`);
    return id;
  };
  for (const r of list) {
    const seasonId = ids.seasonIdByName.get(r.season);
    if (!seasonId) throw new Error(`demo record ${r.id}: unknown season ${r.season}`);
    const versions = demoVersions(r).map((v) => ({
      ...v,
      body: processBody(markdownToDoc(linkMentions(v.markdown, titles))),
    }));
    const newest = versions[versions.length - 1];
    const body = newest.body;
    const authorId = user(r.author);
    // A review covers the newest version that existed on the day of the review.
    const reviewedVersion = r.reviewedOn
      ? Math.max(
          1,
          ...versions
            .filter((v) => v.at.toISOString().slice(0, 10) <= r.reviewedOn!.toISOString().slice(0, 10))
            .map((v) => v.version),
        )
      : null;
    tx.insert(records)
      .values({
        id: r.id,
        kind: r.kind,
        title: r.title,
        subsystemSlug: r.subsystem,
        seasonId,
        status: r.status,
        source: r.source ?? null,
        authorId,
        body: body.doc,
        bodyHtml: body.html,
        bodyText: body.text,
        version: newest.version,
        createdAt: r.createdAt,
        // The date of the current version. A comment is not a version: taking the newest comment's date here
        // once made the facts panel disagree with the history.
        updatedAt: newest.at,
        updatedById: user(newest.author),
        reviewedById: r.reviewedBy ? user(r.reviewedBy) : null,
        reviewedAt: r.reviewedOn ?? null,
        reviewedVersion: r.reviewedBy ? reviewedVersion : null,
      })
      .run();
    for (const v of versions) {
      tx.insert(recordRevisions)
        .values({
          id: newId(),
          recordId: r.id,
          version: v.version,
          title: r.title,
          status: v.status,
          body: v.body.doc,
          bodyText: v.body.text,
          editorId: user(v.author),
          note: v.note || null,
          createdAt: v.at,
        })
        .run();
    }
    const commentIds = new Map<string, string>();
    for (const c of r.comments) {
      const id = newId();
      if (c.key) commentIds.set(c.key, id);
      const parentId = c.replyTo ? commentIds.get(c.replyTo) : null;
      if (parentId === undefined) throw new Error(`demo record ${r.id}: no earlier comment “${c.replyTo}”`);
      tx.insert(comments)
        .values({
          id,
          recordId: r.id,
          authorId: user(c.author),
          parentId,
          kind: c.replyTo ? 'note' : c.kind,
          body: plainMentions(c.body, titles),
          createdAt: c.at,
          answeredAt: c.answeredOn ?? null,
          answeredById: c.answeredBy ? user(c.answeredBy) : null,
        })
        .run();
    }
    for (const name of r.attachments) {
      const { bytes, contentType } = files.get(name)!;
      const stored = storeBytes(bytes);
      tx.insert(attachments)
        .values({
          id: newId(),
          recordId: r.id,
          fileName: name,
          contentType,
          size: stored.size,
          sha256: stored.sha256,
          uploadedById: authorId,
          createdAt: r.createdAt,
        })
        .run();
    }
  }
  for (const r of list) {
    for (const c of r.calculations) tx.insert(recordCalculations).values({ recordId: r.id, calculationId: c }).run();
    for (const rel of r.related)
      tx.insert(recordLinks)
        .values({ fromRecordId: r.id, toRecordId: rel, kind: 'related', createdAt: r.createdAt })
        .onConflictDoNothing()
        .run();
    if (r.supersedes)
      tx.insert(recordLinks)
        .values({ fromRecordId: r.id, toRecordId: r.supersedes, kind: 'supersedes', createdAt: r.createdAt })
        .run();
  }
}
