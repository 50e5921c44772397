// Calls route handlers the way the server does: a real Request, Astro's own cookie class and our middleware,
// so tests exercise session reading, error shapes and headers without a running server.
import type { APIContext, APIRoute } from 'astro';
// AstroCookies is not a public export of astro 5; the path is pinned with the version in package.json.
import { AstroCookies } from '../../node_modules/astro/dist/core/cookies/cookies.js';
import { onRequest } from '../../src/middleware';
import { SESSION_COOKIE } from '../../src/lib/server/auth/lucia';

export interface CallOptions {
  body?: unknown;
  rawBody?: BodyInit;
  headers?: Record<string, string>;
  params?: Record<string, string>;
  query?: Record<string, string>;
  session?: string;
  path?: string;
  ip?: string;
  /** The socket peer the start file passes in as locals.socketAddress (absent unless given). */
  socketAddress?: string;
}

export interface CallResult {
  status: number;
  headers: Headers;
  // JSON answers are read as `any` on purpose: each test's expect() is the type check (decision 011).
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- see above
  body: any;
  text: string;
  bytes: Uint8Array;
  cookies: Map<string, string>;
  /** The raw Set-Cookie header lines. */
  setCookie: string[];
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

const routeIds = new WeakMap<object, number>();
let routeCount = 0;

function defaultPath(route: object, params: Record<string, string> = {}): string {
  if (!routeIds.has(route)) routeIds.set(route, ++routeCount);
  const parts = Object.entries(params).map(([k, v]) => `${k}=${encodeURIComponent(v)}`);
  return `/api/test/route-${routeIds.get(route)}/${parts.join('/')}`;
}

/** Calls a route and hands back its Response unread, for tests that stream a large body. */
export async function callRaw(
  route: Partial<Record<Method, APIRoute>>,
  method: Method,
  options: CallOptions = {},
): Promise<{ response: Response; cookies: AstroCookies }> {
  const handler = route[method];
  if (!handler) throw new Error(`route has no ${method} handler`);
  // Like the server, where the URL names the route and its parameters (the response cache keys on it).
  const url = new URL(options.path ?? defaultPath(route, options.params), 'http://localhost:4321');
  for (const [k, v] of Object.entries(options.query ?? {})) url.searchParams.set(k, v);
  const headers = new Headers(options.headers);
  let body: BodyInit | undefined = options.rawBody;
  if (options.body !== undefined) {
    body = JSON.stringify(options.body);
    headers.set('content-type', 'application/json');
  }
  if (options.session) headers.set('cookie', `${SESSION_COOKIE}=${options.session}`);
  // A streamed body (no content-length, like a chunked upload) needs `duplex: 'half'` in Node's fetch.
  const request = new Request(url, {
    method,
    headers,
    body: method === 'GET' ? undefined : body,
    ...(body instanceof ReadableStream ? { duplex: 'half' } : {}),
  });
  const cookies = new AstroCookies(request);
  const context = {
    request,
    url,
    params: options.params ?? {},
    cookies,
    locals: (options.socketAddress ? { socketAddress: options.socketAddress } : {}) as App.Locals,
    clientAddress: options.ip ?? '127.0.0.1',
    redirect: (location: string, status = 302) => new Response(null, { status, headers: { location } }),
  } as unknown as APIContext;
  const response = (await onRequest(context, async () => handler(context))) as Response;
  return { response, cookies };
}

export async function call(
  route: Partial<Record<Method, APIRoute>>,
  method: Method,
  options: CallOptions = {},
): Promise<CallResult> {
  const { response, cookies } = await callRaw(route, method, options);
  const setCookies = new Map<string, string>();
  const setCookie = [...cookies.headers()];
  for (const header of setCookie) {
    const [pair] = header.split(';');
    const eq = pair.indexOf('=');
    setCookies.set(pair.slice(0, eq), pair.slice(eq + 1));
  }
  const bytes = new Uint8Array(await response.arrayBuffer());
  const text = new TextDecoder().decode(bytes);
  let parsed: unknown = undefined;
  try {
    parsed = text ? JSON.parse(text) : undefined;
  } catch {
    parsed = undefined;
  }
  return {
    status: response.status,
    headers: response.headers,
    body: parsed,
    text,
    bytes,
    cookies: setCookies,
    setCookie,
  };
}
