// The handover bundle as a streamed zip: entries are produced one at a time as the archive is written, and
// attachments are piped from disk, so memory stays flat however large the archive grows.
import { createReadStream, existsSync } from 'node:fs';
import { Readable } from 'node:stream';
import yazl from 'yazl';
import { marked } from 'marked';
import { asc, eq, isNull } from 'drizzle-orm';
import { db } from '../db/client';
import { attachments, records } from '../db/schema';
import { pathForHash } from '../storage';
import {
  attachmentFolder,
  attachmentNames,
  calculationEntries,
  calculationJson,
  indexMarkdown,
  recordEntries,
  recordMarkdown,
} from './content';
import { guideFiles } from './guides';
import { escapeHtml } from '../mail/layout';

export interface BundleCounts {
  records: number;
  guides: number;
  calculations: number;
  attachments: number;
}

// Already-compressed formats are stored as they are; deflating them again costs time and saves nothing.
const STORED_TYPES = /^(image\/(jpeg|png|gif|webp)|application\/pdf)$/;

export async function handoverBundle(
  now = new Date(),
): Promise<{ stream: ReadableStream<Uint8Array>; fileName: string; counts: BundleCounts }> {
  const root = `wakebook-handover-${now.toISOString().slice(0, 10)}`;
  const recs = recordEntries();
  const calcs = calculationEntries();
  const guides = await guideFiles();
  const files = db()
    .select({ a: attachments, title: records.title })
    .from(attachments)
    .innerJoin(records, eq(records.id, attachments.recordId))
    .where(isNull(records.deletedAt))
    .orderBy(asc(attachments.recordId), asc(attachments.createdAt))
    .all();

  const zip = new yazl.ZipFile();
  const text = (name: string, make: () => string | null) =>
    zip.addReadStreamLazy(`${root}/${name}`, { mtime: now }, (cb) => {
      try {
        cb(null, Readable.from(Buffer.from(make() ?? '', 'utf8'), { objectMode: false }));
      } catch (e) {
        cb(e, undefined as never);
      }
    });

  const indexMd = indexMarkdown({
    exportedAt: now,
    records: recs,
    calculations: calcs,
    guides,
    attachmentCount: files.length,
  });
  text('index.md', () => indexMd);
  text('index.html', () => indexHtml(indexMd));
  const recordPaths = new Map(recs.map((r) => [r.id, r.path]));
  const calcPaths = new Map(calcs.map((c) => [c.id, c.path]));
  for (const r of recs) text(r.path, () => recordMarkdown(r.id, recordPaths, calcPaths));
  for (const g of guides) text(g.path, () => g.content);
  for (const c of calcs) text(c.path, () => calculationJson(c.id));

  const byRecord = new Map<string, typeof files>();
  for (const f of files) byRecord.set(f.a.recordId, [...(byRecord.get(f.a.recordId) ?? []), f]);
  for (const [recordId, list] of byRecord) {
    const names = attachmentNames(list.map((f) => f.a));
    const folder = attachmentFolder({ id: recordId, title: list[0].title });
    for (const { a } of list) {
      const name = `${folder}/${names.get(a.id)}`;
      const path = pathForHash(a.sha256);
      if (!existsSync(path)) {
        text(
          `${name}.missing.txt`,
          () =>
            `The file "${a.fileName}" (${a.size} bytes, sha256 ${a.sha256}) was not found in the upload folder when this bundle was made.\n`,
        );
        continue;
      }
      zip.addReadStreamLazy(
        `${root}/${name}`,
        { mtime: a.createdAt, compress: !STORED_TYPES.test(a.contentType), size: a.size },
        (cb) => cb(null, createReadStream(path)),
      );
    }
  }
  // yazl reports a failed entry on the ZipFile, not the output stream; without this an error would end the process.
  zip.on('error', (e: Error) => {
    console.error('[wakebook] the handover bundle failed while streaming:', e);
    (zip.outputStream as Readable).destroy(e);
  });
  zip.end();
  return {
    stream: Readable.toWeb(zip.outputStream as Readable) as ReadableStream<Uint8Array>,
    fileName: `${root}.zip`,
    counts: { records: recs.length, guides: guides.length, calculations: calcs.length, attachments: files.length },
  };
}

function indexHtml(markdown: string): string {
  const body = marked.parse(markdown, { async: false, gfm: true });
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml('Wakebook handover bundle')}</title>
<style>body{background:#f6f1e6;color:#17251e;font:16px/1.6 system-ui,-apple-system,"Segoe UI",Roboto,Arial,sans-serif;max-width:52rem;margin:0 auto;padding:2rem 1rem}
h1,h2,h3{font-family:Georgia,"Times New Roman",serif;line-height:1.25}h1{color:#115e56}a{color:#115e56}code{background:#ede6d6;padding:0 .25rem;border-radius:.2rem}</style>
</head><body>
${body}
</body></html>
`;
}
