import { z } from 'zod';
import type { APIContext } from 'astro';
import { can, type Action, type Subject } from '../policy';
import { OutOfRangeError } from '../calc/errors';

export interface FieldIssue {
  path: string;
  message: string;
}

export type ErrorCode =
  | 'invalid_input'
  | 'invalid_credentials'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'too_large'
  | 'unsupported_type'
  | 'out_of_range'
  | 'idempotency_key_reused'
  | 'rate_limited'
  | 'internal';

/** Thrown anywhere below a route; `handle` turns it into the error shape of API.md. */
export class HttpError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: ErrorCode,
    message: string,
    public readonly issues: FieldIssue[] = [],
    public readonly extra: Record<string, unknown> = {},
    public readonly headers: Record<string, string> = {},
  ) {
    super(message);
  }
}

export const notFound = (what = 'That') => new HttpError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, extra: Record<string, unknown> = {}) =>
  new HttpError(409, 'conflict', message, [], extra);

export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(status === 204 ? null : JSON.stringify(data), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

export function errorBody(
  code: ErrorCode,
  message: string,
  issues: FieldIssue[] = [],
  extra: Record<string, unknown> = {},
) {
  return { error: { code, message, issues, ...extra } };
}

export function errorResponse(err: HttpError): Response {
  return json(errorBody(err.code, err.message, err.issues, err.extra), err.status, err.headers);
}

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
}

export function invalidInput(issues: FieldIssue[], message = 'Some fields need attention.'): HttpError {
  return new HttpError(400, 'invalid_input', message, issues);
}

export function parseWith<T extends z.ZodType>(schema: T, value: unknown): z.infer<T> {
  const result = schema.safeParse(value);
  if (!result.success) throw invalidInput(zodIssues(result.error));
  return result.data;
}

export const DEFAULT_JSON_LIMIT = 256 * 1024;

/** Reads a JSON body within a size limit and validates it. */
export async function readJson<T extends z.ZodType>(
  request: Request,
  schema: T,
  maxBytes = DEFAULT_JSON_LIMIT,
): Promise<z.infer<T>> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes)
    throw new HttpError(413, 'too_large', `The request body is over ${Math.round(maxBytes / 1024)} kB.`);
  let text: string;
  try {
    text = await readLimited(request, maxBytes);
  } catch (e) {
    if (e instanceof HttpError) throw e;
    throw invalidInput([], 'The request body could not be read.');
  }
  let value: unknown;
  try {
    value = text.length === 0 ? {} : JSON.parse(text);
  } catch {
    throw invalidInput([{ path: '', message: 'Body is not valid JSON.' }], 'The request body is not valid JSON.');
  }
  if (nestedDeeperThan(value, MAX_JSON_DEPTH))
    throw invalidInput(
      [{ path: '', message: `The body is nested more than ${MAX_JSON_DEPTH} levels deep.` }],
      'The request body is nested too deeply.',
    );
  return parseWith(schema, value);
}

/**
 * JSON.parse accepts any depth, but zod, JSON.stringify and our own walkers recurse and overflow the stack a few
 * thousand levels down. A record body is the deepest thing we take: 40 editor nodes deep, two JSON levels each.
 */
const MAX_JSON_DEPTH = 100;

/** Walks with an explicit stack, so the check itself cannot overflow. */
function nestedDeeperThan(root: unknown, limit: number): boolean {
  const stack: [unknown, number][] = [[root, 1]];
  while (stack.length) {
    const [value, depth] = stack.pop()!;
    if (value === null || typeof value !== 'object') continue;
    if (depth > limit) return true;
    for (const child of Array.isArray(value) ? value : Object.values(value)) stack.push([child, depth + 1]);
  }
  return false;
}

async function readLimited(request: Request, maxBytes: number): Promise<string> {
  if (!request.body) return '';
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw new HttpError(413, 'too_large', `The request body is over ${Math.round(maxBytes / 1024)} kB.`);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

export function parseQuery<T extends z.ZodType>(url: URL, schema: T): z.infer<T> {
  const raw: Record<string, string> = {};
  for (const [k, v] of url.searchParams) raw[k] = v;
  return parseWith(schema, raw);
}

export function requireUser(locals: App.Locals) {
  if (!locals.user) throw new HttpError(401, 'unauthenticated', 'Please sign in first.');
  return locals.user;
}

export function requirePermission(locals: App.Locals, action: Action, subject?: Subject) {
  const user = requireUser(locals);
  if (!can(user, action, subject)) throw new HttpError(403, 'forbidden', 'Your role may not do this.');
  return user;
}

type Handler = (context: APIContext) => Promise<Response> | Response;

/** Wraps a route: every thrown error becomes the API.md shape; nothing internal reaches the client. */
export function handle(fn: Handler): Handler {
  return async (context) => {
    try {
      return await fn(context);
    } catch (e) {
      return toErrorResponse(e, context);
    }
  };
}

export function toErrorResponse(e: unknown, context?: Pick<APIContext, 'request'>): Response {
  if (e instanceof HttpError) return errorResponse(e);
  if (e instanceof z.ZodError) return errorResponse(invalidInput(zodIssues(e)));
  if (e instanceof OutOfRangeError) {
    return errorResponse(
      new HttpError(422, 'out_of_range', e.message, [{ path: e.input, message: e.message }], { input: e.input }),
    );
  }
  console.error(
    `[wakebook] ${context?.request.method ?? ''} ${context ? new URL(context.request.url).pathname : ''} failed:`,
    e,
  );
  return json(errorBody('internal', 'Something went wrong on our side. Nothing you sent was lost; try again.'), 500);
}
