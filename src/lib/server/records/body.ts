import { getSchema, type JSONContent } from '@tiptap/core';
import { generateHTML } from '@tiptap/html/server';
import { recordExtensions } from '../../editor/extensions';
import { isSafeHref } from '../../editor/links';
import { invalidInput } from '../http';

const extensions = recordExtensions();
const schema = getSchema(extensions);

export const MAX_BODY_CHARS = 400_000;
const MAX_DEPTH = 40;
const HEADING_LEVELS = [2, 3];
const MAX_LIST_START = 100_000;

export interface ProcessedBody {
  doc: JSONContent;
  html: string;
  text: string;
}

interface AttrRule {
  valid: (value: unknown) => boolean;
  /** Used instead of a bad value when a stored document is repaired for display. */
  fallback: unknown;
  required?: boolean;
  message: string;
}

/**
 * The only node attributes a stored record keeps, with the values each may take. The schema checks node types but
 * not attribute values, so without this list any string would reach the stored JSON and the rendered HTML.
 */
const NODE_ATTRS: Record<string, Record<string, AttrRule>> = {
  heading: {
    level: {
      valid: (v) => HEADING_LEVELS.includes(v as number),
      fallback: HEADING_LEVELS[0],
      required: true,
      message: 'Headings may be level 2 or 3.',
    },
  },
  codeBlock: {
    language: {
      valid: (v) => v === null || (typeof v === 'string' && /^[a-z0-9+#-]{1,32}$/.test(v)),
      fallback: null,
      message: 'A code block language is a short name of lower-case letters, digits, +, # or -.',
    },
  },
  orderedList: {
    start: {
      valid: (v) => Number.isSafeInteger(v) && (v as number) >= 1 && (v as number) <= MAX_LIST_START,
      fallback: 1,
      message: `A numbered list starts at a whole number from 1 to ${MAX_LIST_START}.`,
    },
  },
  taskItem: {
    checked: { valid: (v) => typeof v === 'boolean', fallback: false, message: 'A task is either done or not.' },
  },
};

class BodyProblem extends Error {}

/**
 * Validates a ProseMirror document against the editor's own schema and the attribute allow-list, drops unsafe links
 * and every link attribute but `href`, and renders the HTML and plain text the app shows and searches. Client HTML
 * is never accepted; this HTML comes from the validated tree. `repair` (for stored revisions written before a rule
 * existed) replaces a bad attribute value instead of refusing the document.
 */
export function processBody(input: unknown, { repair = false } = {}): ProcessedBody {
  const fail = (message: string) => invalidInput([{ path: 'body', message }], 'The record text could not be read.');
  if (!input || typeof input !== 'object' || Array.isArray(input)) throw fail('The body must be an editor document.');
  let cleaned: JSONContent;
  try {
    cleaned = clean(input, 0, repair);
  } catch (e) {
    if (e instanceof BodyProblem) throw fail(e.message);
    throw e;
  }
  // Measured on the cleaned copy: it is bounded in depth, so serialising it cannot overflow the stack.
  if (JSON.stringify(cleaned).length > MAX_BODY_CHARS)
    throw fail(`The text is too long (over ${MAX_BODY_CHARS / 1000}k characters of document).`);
  if (cleaned.type !== 'doc') throw fail('The body must be a document (type "doc").');
  let node;
  try {
    node = schema.nodeFromJSON(cleaned);
    node.check();
  } catch (e) {
    throw fail(
      `The document does not fit the editor's structure: ${e instanceof Error ? e.message.slice(0, 200) : 'invalid'}.`,
    );
  }
  const doc = keepOnlyLinkHref(node.toJSON() as JSONContent);
  return { doc, html: generateHTML(doc, extensions), text: node.textBetween(0, node.content.size, '\n', ' ').trim() };
}

/** Copies only the known shape of a node: allowed attributes with allowed values, safe links with only `href`. */
function clean(n: JSONContent, depth: number, repair: boolean): JSONContent {
  if (depth > MAX_DEPTH) throw new BodyProblem('The document is nested too deeply.');
  const out: JSONContent = { type: String(n.type ?? '') };
  const attrs = cleanAttrs(out.type!, n.attrs, repair);
  if (attrs) out.attrs = attrs;
  if (typeof n.text === 'string') out.text = n.text;
  if (Array.isArray(n.marks)) {
    out.marks = n.marks
      .filter((m) => m && typeof m === 'object' && typeof m.type === 'string')
      .filter((m) => m.type !== 'link' || isSafeHref(m.attrs?.href))
      .map((m) => (m.type === 'link' ? { type: 'link', attrs: { href: m.attrs!.href as string } } : { type: m.type }));
  }
  if (Array.isArray(n.content)) {
    const kids: JSONContent[] = [];
    for (const child of n.content) {
      if (!child || typeof child !== 'object') continue;
      kids.push(clean(child, depth + 1, repair));
    }
    out.content = kids;
  }
  return out;
}

function cleanAttrs(type: string, given: unknown, repair: boolean): Record<string, unknown> | undefined {
  const rules = NODE_ATTRS[type];
  if (!rules) return undefined;
  const source = given && typeof given === 'object' && !Array.isArray(given) ? (given as Record<string, unknown>) : {};
  const out: Record<string, unknown> = {};
  for (const [name, rule] of Object.entries(rules)) {
    const value = source[name];
    if (value === undefined && !rule.required) continue;
    if (rule.valid(value)) out[name] = value;
    else if (repair) out[name] = rule.fallback;
    else throw new BodyProblem(rule.message);
  }
  return Object.keys(out).length ? out : undefined;
}

/** The link mark's other attributes get schema defaults on the way through ProseMirror; none of them is stored. */
function keepOnlyLinkHref(n: JSONContent): JSONContent {
  const out: JSONContent = { ...n };
  if (n.marks)
    out.marks = n.marks.map((m) =>
      m.type === 'link' ? { type: 'link', attrs: { href: m.attrs?.href as unknown } } : m,
    );
  if (n.content) out.content = n.content.map(keepOnlyLinkHref);
  return out;
}
