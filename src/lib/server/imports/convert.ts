// Turns one imported file into an editor document. Every format first becomes HTML (Word files through mammoth,
// Markdown through marked, text and PDF text as paragraphs), which is tidied to what the editor has (headings 2–3,
// tables as text tables, images as links to their attachments) and then read by the editor's own HTML parser: the
// ProseMirror DOMParser of the schema built from the editor's extensions, which is what `generateJSON` of
// @tiptap/html runs, with the schema built once instead of on every call (that took 14 of generateJSON's 19 ms).
// Whatever the editor has no node or mark for is dropped there, and the record path validates the result once more
// like anything typed.
import { getSchema, type JSONContent } from '@tiptap/core';
import { DOMParser as SchemaParser } from '@tiptap/pm/model';
import { Window } from 'happy-dom';
import { marked } from 'marked';
import { recordExtensions } from '../../editor/extensions';
import { isAttachmentSrc, isSafeHref } from '../../editor/links';
import { MAX_IMAGE_ALT } from '../records/body';
import { openZip, ZipTooLarge, ZipUnreadable, MAX_RATIO } from './zip';

/** A file the importer cannot read: the message says why, as a sentence about the file. */
export class ImportProblem extends Error {}

export interface ImageFound {
  bytes: Uint8Array;
  /** A file name for the attachment. */
  name: string;
}

export interface Converted {
  title: string | null;
  doc: JSONContent;
  /** The date the document says it was written, when it says. */
  date: Date | null;
  images: ImageFound[];
}

/** Where an image goes: `link(i)` gives the URL the body links to for `images[i]` (its attachment's address). */
type ImageLinker = (index: number) => string;

const parser = SchemaParser.fromSchema(getSchema(recordExtensions()));
const WINDOW_SETTINGS = {
  disableJavaScriptEvaluation: true,
  disableJavaScriptFileLoading: true,
  disableCSSFileLoading: true,
  disableIframePageLoading: true,
  disableComputedStyleRendering: true,
};
/**
 * How much text a converter is given at most. Parsing takes memory tens of times the size of what it parses (a
 * 42 MB document part took over 2 GB of heap), and a record holds at most MAX_BODY_CHARS (400k characters of
 * document) in any case: a longer file is refused before it is parsed, so no upload can exhaust the server's heap.
 * Each limit sits well above what a 400k-character record takes in that format (Word repeats its formatting per
 * run of text; a web page saved from an office program carries styles).
 */
export const TEXT_LIMITS = {
  /** The unzipped `word/document.xml` of a .docx. */
  docx: 8 * 1024 * 1024,
  html: 4 * 1024 * 1024,
  /** Markdown and plain text. */
  text: 2 * 1024 * 1024,
  /** Pages of a PDF: its text is read page by page, and 400k characters fill some 150 pages of dense text. */
  pdfPages: 1000,
};

function tooLong(bytes: number, limit: number, what: string): ImportProblem {
  return new ImportProblem(
    `it is too long for one record: ${Math.ceil(bytes / 1024 / 1024)} MB of ${what}, over the limit of ` +
      `${limit / 1024 / 1024} MB (a record holds about 400k characters). Split it, or attach it to a record instead.`,
  );
}

/** A Word file is a zip too: the same checks keep its parts from unzipping into gigabytes. */
const DOCX_LIMITS = { maxEntries: 2000, maxTotalBytes: 200 * 1024 * 1024, maxRatio: MAX_RATIO };

export function extensionOf(name: string): string {
  const m = /\.([A-Za-z0-9]+)$/.exec(name);
  return m ? m[1].toLowerCase() : '';
}

export function baseName(name: string): string {
  return (name.split(/[\\/]/).pop() ?? name).replace(/\.[A-Za-z0-9]+$/, '');
}

/** Text files come in UTF-8 (with or without a byte-order mark) or, from older machines, Windows-1252. */
function decodeText(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder('windows-1252').decode(bytes);
  }
}

const escapeHtml = (s: string) =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** Paragraphs split at blank lines; line breaks inside one are kept (`keepLines`) or joined with spaces. */
function textToHtml(text: string, keepLines: boolean): string {
  return text
    .replace(/\r\n?/g, '\n')
    .split(/\n[ \t]*\n+/)
    .map((p) => p.replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/g, '').trim())
    .filter(Boolean)
    .map((p) => {
      const lines = p.split('\n').map((l) => escapeHtml(l.trim()));
      return `<p>${keepLines ? lines.join('<br>') : lines.join(' ')}</p>`;
    })
    .join('');
}

/** A date from a document's metadata, only when it reads as a real date between 1980 and next year. */
function plausibleDate(value: string | null | undefined): Date | null {
  if (!value) return null;
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return null;
  const year = d.getUTCFullYear();
  return year >= 1980 && year <= new Date().getUTCFullYear() + 1 ? d : null;
}

/** PDF dates look like D:20230504120000Z or D:20230504120000+02'00'. */
function pdfDate(value: unknown): Date | null {
  if (typeof value !== 'string') return null;
  const m = /^D:(\d{4})(\d{2})?(\d{2})?(\d{2})?(\d{2})?(\d{2})?/.exec(value);
  if (!m) return null;
  const [, y, mo = '01', d = '01', h = '00', mi = '00', s = '00'] = m;
  return plausibleDate(`${y}-${mo}-${d}T${h}:${mi}:${s}Z`);
}

/** Pads a table's cells into aligned columns: the editor has no tables, so a table becomes a text table. */
function textTable(rows: string[][]): string {
  const widths: number[] = [];
  for (const row of rows) row.forEach((c, i) => (widths[i] = Math.max(widths[i] ?? 0, c.length)));
  const line = (row: string[]) => `| ${widths.map((w, i) => (row[i] ?? '').padEnd(w)).join(' | ')} |`;
  const out = rows.map(line);
  if (out.length > 1) out.splice(1, 0, `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  return out.join('\n');
}

/**
 * Brings HTML to what the editor has: no scripts or styles; headings at level 2 or 3; each table as a text table in
 * a code block; each image the document carries as an image of its attachment, where it stood; each image that
 * lives elsewhere on the web as a link to it. `images` collects images carried inside the HTML as data: URLs.
 */
function tidy(
  doc: Document,
  root: Element,
  options: { imageLink: (src: string, alt: string) => string | null; dropTitle: string | null },
): void {
  for (const el of [
    ...root.querySelectorAll('script, style, noscript, template, iframe, object, embed, head, title, meta, link'),
  ])
    el.remove();
  // Tables: innermost first, so a table inside a cell is text before its parent is read.
  for (const table of [...root.querySelectorAll('table')].reverse()) {
    const rows = [...table.querySelectorAll('tr')].map((tr) =>
      [...tr.children]
        .filter((c) => c.tagName === 'TD' || c.tagName === 'TH')
        .map((c) => (c.textContent ?? '').replace(/\s+/g, ' ').trim()),
    );
    const pre = doc.createElement('pre');
    const code = doc.createElement('code');
    code.textContent = textTable(rows.filter((r) => r.length > 0));
    pre.appendChild(code);
    table.replaceWith(pre);
  }
  for (const img of [...root.querySelectorAll('img')]) {
    const src = img.getAttribute('src') ?? '';
    const alt = (img.getAttribute('alt') ?? '').replace(/\s+/g, ' ').trim();
    const href = options.imageLink(src, alt);
    if (!href) {
      img.replaceWith(doc.createTextNode(alt ? `[image: ${alt}]` : ''));
      continue;
    }
    // An image the document carries shows where it stood; a picture elsewhere on the web stays a link to it.
    if (isAttachmentSrc(href)) {
      const shown = doc.createElement('img');
      shown.setAttribute('src', href);
      if (alt) shown.setAttribute('alt', Array.from(alt).slice(0, MAX_IMAGE_ALT).join(''));
      // A paragraph holding only the picture becomes the picture (no empty paragraph left around the block).
      const parent = img.parentElement;
      const alone = parent?.tagName === 'P' && !(parent.textContent ?? '').trim() && parent.children.length === 1;
      (alone ? parent : img).replaceWith(shown);
      continue;
    }
    const a = doc.createElement('a');
    a.setAttribute('href', href);
    a.textContent = `Image: ${alt || 'figure'}`;
    img.replaceWith(a);
  }
  let dropped = false;
  for (const h of [...root.querySelectorAll('h1, h2, h3, h4, h5, h6')]) {
    const text = (h.textContent ?? '').replace(/\s+/g, ' ').trim();
    if (!dropped && options.dropTitle && text === options.dropTitle) {
      dropped = true;
      h.remove();
      continue;
    }
    const level = Number(h.tagName[1]) <= 2 ? 2 : 3;
    if (Number(h.tagName[1]) !== level) {
      const n = doc.createElement(`h${level}`);
      while (h.firstChild) n.appendChild(h.firstChild);
      h.replaceWith(n);
    }
  }
}

function firstHeadingOf(root: Element): string | null {
  for (const h of root.querySelectorAll('h1, h2, h3, h4, h5, h6')) {
    const text = (h.textContent ?? '').replace(/\s+/g, ' ').trim();
    if (text) return text;
  }
  return null;
}

/** HTML (from any format) → the editor's document, with images carried as data: URLs collected into `images`. */
function htmlToDocument(
  html: string,
  { title, link, images }: { title: string | null; link: ImageLinker; images: ImageFound[] },
): { title: string | null; doc: JSONContent; meta: Document } {
  // A window of its own for each file: nothing one document leaves behind reaches the next.
  const window = new Window({ settings: WINDOW_SETTINGS });
  try {
    const parsed = new window.DOMParser().parseFromString(html, 'text/html') as unknown as Document;
    const metaTitle = title ?? (parsed.querySelector('title')?.textContent ?? '').replace(/\s+/g, ' ').trim();
    const heading = firstHeadingOf(parsed.body);
    const chosen = metaTitle || heading || null;
    tidy(parsed, parsed.body, {
      // Only the first heading is dropped, and only when it is the title, so the text does not say it twice.
      dropTitle: chosen && chosen === heading ? chosen : null,
      imageLink: (src, alt) => {
        if (src.startsWith('wakebook-image:')) return link(Number(src.slice('wakebook-image:'.length)));
        const data = /^data:(image\/(?:png|jpeg|gif|webp));base64,([A-Za-z0-9+/=\s]+)$/i.exec(src);
        if (data) {
          const ext = data[1].toLowerCase() === 'image/jpeg' ? 'jpg' : data[1].slice(6).toLowerCase();
          images.push({ bytes: Buffer.from(data[2], 'base64'), name: `${alt || 'image'}-${images.length + 1}.${ext}` });
          return link(images.length - 1);
        }
        return isSafeHref(src) && /^https?:/i.test(src.trim()) ? src.trim() : null;
      },
    });
    const doc = parser.parse(parsed.body).toJSON() as JSONContent;
    return { title: chosen, doc, meta: parsed };
  } finally {
    void window.happyDOM.abort();
    void window.happyDOM.close();
  }
}

function metaDate(doc: Document): Date | null {
  for (const name of ['date', 'dcterms.created', 'dc.date', 'article:published_time', 'created']) {
    const el = doc.querySelector(`meta[name="${name}" i]`) ?? doc.querySelector(`meta[property="${name}" i]`) ?? null;
    const d = plausibleDate(el?.getAttribute('content'));
    if (d) return d;
  }
  const time = doc.querySelector('time[datetime]');
  return plausibleDate(time?.getAttribute('datetime'));
}

async function readDocxCore(bytes: Buffer): Promise<{ title: string | null; date: Date | null }> {
  let zip;
  try {
    zip = await openZip(bytes, DOCX_LIMITS);
  } catch (e) {
    if (e instanceof ZipTooLarge) throw new ImportProblem(`it is not a Word file we can open safely: ${e.message}.`);
    throw new ImportProblem('it is not a Word (.docx) file: it could not be opened as one.');
  }
  try {
    const main = zip.entries.find((e) => e.name === 'word/document.xml');
    if (!main) throw new ImportProblem('it is not a Word (.docx) file: it has no document part.');
    if (main.size > TEXT_LIMITS.docx) throw tooLong(main.size, TEXT_LIMITS.docx, 'document text');
    const core = zip.entries.find((e) => e.name === 'docProps/core.xml');
    if (!core || core.size > 256 * 1024) return { title: null, date: null };
    const xml = (await zip.read(core)).toString('utf8');
    const pick = (tag: string) => {
      const m = new RegExp(`<${tag}[^>]*>([^<]*)</${tag}>`).exec(xml);
      return m ? m[1].replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&').trim() : null;
    };
    return { title: pick('dc:title') || null, date: plausibleDate(pick('dcterms:created')) };
  } catch (e) {
    if (e instanceof ImportProblem) throw e;
    if (e instanceof ZipUnreadable) throw new ImportProblem('it is a damaged Word file: a part could not be read.');
    throw e;
  } finally {
    zip.close();
  }
}

async function fromDocx(bytes: Buffer, link: ImageLinker) {
  const core = await readDocxCore(bytes);
  const mammoth = (await import('mammoth')).default;
  const images: ImageFound[] = [];
  let html: string;
  try {
    const result = await mammoth.convertToHtml(
      { buffer: bytes },
      {
        convertImage: mammoth.images.imgElement(async (image) => {
          // Drawings in Word's own vector formats (EMF, WMF) cannot be shown in a browser: their alt text stays.
          if (!/^image\/(png|jpeg|gif|webp)$/.test(image.contentType ?? '')) return { src: '' };
          const data = await image.readAsBuffer();
          const ext = (image.contentType ?? '').split('/')[1]?.replace('jpeg', 'jpg') ?? 'bin';
          images.push({ bytes: data, name: `image-${images.length + 1}.${ext}` });
          return { src: `wakebook-image:${images.length - 1}` };
        }),
      },
    );
    html = result.value;
  } catch (e) {
    throw new ImportProblem(
      `it is a damaged Word file (${e instanceof Error ? e.message.slice(0, 120) : 'unreadable'}).`,
    );
  }
  const { title, doc } = htmlToDocument(html, { title: core.title, link, images });
  return { title, doc, date: core.date, images };
}

async function fromPdf(bytes: Buffer) {
  const { extractText, getDocumentProxy, getMeta } = await import('unpdf');
  let pages: string[];
  let info: Record<string, unknown> = {};
  try {
    const pdf = await getDocumentProxy(new Uint8Array(bytes));
    if (pdf.numPages > TEXT_LIMITS.pdfPages) {
      const count = pdf.numPages;
      await pdf.destroy();
      throw new ImportProblem(
        `it is too long for one record: ${count} pages, over the limit of ${TEXT_LIMITS.pdfPages} (a record holds ` +
          'about 400k characters). Split it, or attach it to a record instead.',
      );
    }
    try {
      info = ((await getMeta(pdf)).info ?? {}) as Record<string, unknown>;
    } catch {
      info = {};
    }
    pages = (await extractText(pdf, { mergePages: false })).text;
    await pdf.destroy();
  } catch (e) {
    if (e instanceof ImportProblem) throw e;
    throw new ImportProblem(
      `it is not a PDF we can read (${e instanceof Error ? e.message.slice(0, 120) : 'unreadable'}).`,
    );
  }
  const html = pages.map((p) => textToHtml(p, false)).join('');
  if (!html)
    throw new ImportProblem('it has no text to read (a scanned PDF needs text recognition first; attach it instead).');
  const title = typeof info.Title === 'string' && info.Title.trim() ? info.Title.trim() : null;
  const { doc } = htmlToDocument(html, { title, link: () => '', images: [] });
  return { title, doc, date: pdfDate(info.CreationDate) };
}

/**
 * Reads one file by its name's ending. Throws ImportProblem for a file it cannot read; `link(i)` names the address
 * the body should link image `i` of the result to.
 */
export async function convertFile(bytes: Buffer, fileName: string, link: ImageLinker): Promise<Converted> {
  const ext = extensionOf(fileName);
  switch (ext) {
    case 'docx':
      return fromDocx(bytes, link);
    case 'pdf': {
      const r = await fromPdf(bytes);
      return { ...r, images: [] };
    }
    case 'md':
    case 'markdown': {
      if (bytes.length > TEXT_LIMITS.text) throw tooLong(bytes.length, TEXT_LIMITS.text, 'Markdown');
      const text = decodeText(bytes).replace(/^\uFEFF/, '');
      const images: ImageFound[] = [];
      const html = await marked.parse(text, { gfm: true });
      const { title, doc } = htmlToDocument(html, { title: null, link, images });
      return { title, doc, date: null, images };
    }
    case 'html':
    case 'htm': {
      if (bytes.length > TEXT_LIMITS.html) throw tooLong(bytes.length, TEXT_LIMITS.html, 'web page');
      const text = decodeText(bytes).replace(/^\uFEFF/, '');
      const images: ImageFound[] = [];
      const { title, doc, meta } = htmlToDocument(text, { title: null, link, images });
      return { title, doc, date: metaDate(meta), images };
    }
    case 'txt': {
      if (bytes.length > TEXT_LIMITS.text) throw tooLong(bytes.length, TEXT_LIMITS.text, 'text');
      const text = decodeText(bytes).replace(/^\uFEFF/, '');
      const { doc } = htmlToDocument(textToHtml(text, true), { title: null, link, images: [] });
      return { title: null, doc, date: null, images: [] };
    }
    default:
      throw new ImportProblem(`files ending in .${ext || '(nothing)'} cannot be imported.`);
  }
}
