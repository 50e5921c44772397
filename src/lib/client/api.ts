// The one way islands talk to the API: JSON in and out, and errors that carry the status and the API error body,
// so islands branch on `status` and `body.error.code`, never on message text.
import type { OutboxEntry } from './outbox';

export interface ApiErrorBody {
  error: { code: string; message: string; issues: { path: string; message: string }[]; [k: string]: unknown };
}

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly body: ApiErrorBody | null,
  ) {
    super(body?.error.message ?? `Request failed (${status})`);
  }

  /** Field messages keyed by path, for forms. */
  fieldErrors(prefix = ''): Record<string, string> {
    const out: Record<string, string> = {};
    for (const i of this.body?.error.issues ?? []) {
      const path = prefix && i.path.startsWith(prefix) ? i.path.slice(prefix.length) : i.path;
      out[path] ??= i.message;
    }
    return out;
  }
}

/** A key for Idempotency-Key: random, 8–128 of [A-Za-z0-9_-] (randomUUID needs a secure context; this does not). */
export function newKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** Thrown instead of a network error by a write that may wait: it is in the outbox and will be sent later. */
export class KeptOnDevice extends Error {
  constructor(public readonly entry: OutboxEntry) {
    super('Kept on this device — it will be sent when you are back online.');
  }
}

/**
 * `offline: {label}` opts a JSON write into the outbox: with no network it is kept on this device (KeptOnDevice)
 * and sent later under the same Idempotency-Key. Every write carries a key, so a retry never makes it twice.
 */
export async function apiFetch<T>(
  url: string,
  init: RequestInit & { json?: unknown; offline?: { label: string } } = {},
): Promise<T> {
  const { json, offline, ...rest } = init;
  const headers = new Headers(rest.headers);
  if (json !== undefined) headers.set('content-type', 'application/json');
  headers.set('accept', 'application/json');
  const method = (rest.method ?? 'GET').toUpperCase();
  if (method !== 'GET' && !headers.has('idempotency-key')) headers.set('idempotency-key', newKey());
  const keep = async (error: unknown): Promise<never> => {
    if (!offline) throw error;
    const version = (json as { version?: unknown } | undefined)?.version;
    // The outbox (and its IndexedDB code) loads only when a write has to wait; the service worker keeps its file.
    // Should that fail too (nowhere to keep it), the island gets that error: not an ApiError, so "could not reach".
    const { keepChange } = await import('./outbox');
    const entry = await keepChange({
      key: headers.get('idempotency-key')!,
      method,
      url,
      body: json,
      label: offline.label,
      baseVersion: typeof version === 'number' ? version : undefined,
    });
    throw new KeptOnDevice(entry);
  };
  if (offline && !navigator.onLine) return keep(new TypeError('offline'));
  let res: Response;
  try {
    res = await fetch(url, {
      ...rest,
      headers,
      body: json !== undefined ? JSON.stringify(json) : rest.body,
      credentials: 'same-origin',
    });
  } catch (e) {
    return keep(e);
  }
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let body: unknown = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  if (!res.ok) throw new ApiError(res.status, (body as ApiErrorBody) ?? null);
  return body as T;
}

/** The `error.message` of an API error body given as text, when it is one. */
export function apiErrorMessage(text: string): string | undefined {
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return undefined;
  }
  if (typeof body !== 'object' || body === null || !('error' in body)) return undefined;
  const { error } = body;
  if (typeof error !== 'object' || error === null || !('message' in error)) return undefined;
  return typeof error.message === 'string' ? error.message : undefined;
}

/** SWR's fetcher. */
export const fetcher = <T>(url: string) => apiFetch<T>(url);

// How many changes the person's outbox holds, mirrored in localStorage so that every page can tell at once, without
// loading the outbox's IndexedDB code, whether there is anything to send or to warn about (the outbox keeps it current).

/** Fired on window whenever the outbox changes in this tab. */
export const OUTBOX_CHANGED = 'wakebook:outbox';

export function hintKey(): string {
  return `wakebook-outbox-count:${document.documentElement.dataset.person ?? ''}`;
}

export function readHint(): number {
  try {
    return Number(window.localStorage.getItem(hintKey()) ?? '0') || 0;
  } catch {
    return 0;
  }
}
