// The one way islands talk to the API: JSON in and out, and errors that carry the status and the API error body,
// so islands branch on `status` and `body.error.code`, never on message text.

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

export async function apiFetch<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, ...rest } = init;
  const headers = new Headers(rest.headers);
  if (json !== undefined) headers.set('content-type', 'application/json');
  headers.set('accept', 'application/json');
  const res = await fetch(url, {
    ...rest,
    headers,
    body: json !== undefined ? JSON.stringify(json) : rest.body,
    credentials: 'same-origin',
  });
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
