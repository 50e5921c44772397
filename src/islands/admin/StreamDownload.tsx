import { useRef, useState } from 'react';
import { ApiError, type ApiErrorBody } from '~/lib/client/api';

interface Props {
  url: string;
  label: string;
  /** Used when the response names no file. */
  fallbackName: string;
}

function formatBytes(n: number): string {
  if (n < 1024) return `${n} bytes`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(0)} kB`;
  return `${(n / 1024 / 1024).toFixed(1)} MB`;
}

/**
 * Downloads a streamed file with fetch and shows the bytes received as they arrive. A zip written on the fly has
 * no known total, so progress is a running count and a busy state rather than a percentage.
 */
export default function StreamDownload({ url, label, fallbackName }: Props) {
  const [state, setState] = useState<'idle' | 'busy' | 'done' | 'error'>('idle');
  const [received, setReceived] = useState(0);
  const [total, setTotal] = useState<number | null>(null);
  const [error, setError] = useState('');
  const abort = useRef<AbortController | null>(null);

  async function start() {
    setState('busy');
    setReceived(0);
    setError('');
    abort.current = new AbortController();
    try {
      const res = await fetch(url, { credentials: 'same-origin', signal: abort.current.signal });
      if (!res.ok || !res.body) {
        const body = (await res.json().catch(() => null)) as ApiErrorBody | null;
        throw new ApiError(res.status, body);
      }
      const length = Number(res.headers.get('content-length'));
      setTotal(Number.isFinite(length) && length > 0 ? length : null);
      const name = /filename="([^"]+)"/.exec(res.headers.get('content-disposition') ?? '')?.[1] ?? fallbackName;
      const reader = res.body.getReader();
      const chunks: Uint8Array<ArrayBuffer>[] = [];
      let count = 0;
      for (;;) {
        const { done, value } = await reader.read();
        if (done) break;
        chunks.push(value);
        count += value.byteLength;
        setReceived(count);
      }
      const href = URL.createObjectURL(
        new Blob(chunks, { type: res.headers.get('content-type') ?? 'application/octet-stream' }),
      );
      const a = document.createElement('a');
      a.href = href;
      a.download = name;
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(href), 60_000);
      setState('done');
    } catch (e) {
      if (e instanceof DOMException && e.name === 'AbortError') {
        setState('idle');
        return;
      }
      setState('error');
      setError(e instanceof ApiError ? e.message : 'The download was interrupted. Try again.');
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2">
        <button
          type="button"
          className="btn btn-primary"
          onClick={start}
          disabled={state === 'busy'}
          aria-describedby={`${fallbackName}-progress`}
        >
          {state === 'busy' ? 'Preparing…' : label}
        </button>
        {state === 'busy' && (
          <button type="button" className="btn btn-quiet" onClick={() => abort.current?.abort()}>
            Cancel
          </button>
        )}
      </div>
      <p
        id={`${fallbackName}-progress`}
        role="status"
        aria-live="polite"
        aria-busy={state === 'busy'}
        className="text-sm text-muted tabular"
      >
        {state === 'busy' && (
          <>
            <span
              className="mr-2 inline-block h-3 w-3 animate-spin rounded-full border-2 border-accent border-t-transparent align-middle"
              aria-hidden="true"
            />
            {formatBytes(received)} received{total ? ` of ${formatBytes(total)}` : ''}…
          </>
        )}
        {state === 'done' && `Done: ${formatBytes(received)} saved.`}
      </p>
      {state === 'busy' && total && (
        <progress className="w-64" max={total} value={received} aria-label="Download progress" />
      )}
      {state === 'error' && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
    </div>
  );
}
