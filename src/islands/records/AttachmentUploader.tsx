import { lazy, Suspense, useRef, useState } from 'react';
import { apiErrorMessage } from '~/lib/client/api';
import DropZone from '../ui/DropZone';

// The plot (uPlot and the CSV parser, ~33 kB gzip) loads only once a CSV has been added here, not with every record page.
const CsvPreview = lazy(() => import('./CsvPreview'));

/** What POST /api/records/{id}/attachments answers with (the fields this island shows). */
interface Added {
  id: string;
  fileName: string;
  url: string;
  isImage: boolean;
  isCsv: boolean;
}

interface Upload {
  name: string;
  progress: number;
  state: 'uploading' | 'done' | 'error';
  message?: string;
}

/** Drag-and-drop or pick files; each uploads with its own progress bar (XHR, since fetch reports no upload progress). */
export default function AttachmentUploader({ recordId, maxMb }: { recordId: string; maxMb: number }) {
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [added, setAdded] = useState<Added[]>([]);
  const input = useRef<HTMLInputElement>(null);

  const update = (i: number, patch: Partial<Upload>) =>
    setUploads((u) => u.map((x, j) => (j === i ? { ...x, ...patch } : x)));

  function send(files: FileList | File[]) {
    const list = Array.from(files);
    setUploads((u) => {
      const start = u.length;
      list.forEach((file, k) => {
        const i = start + k;
        if (file.size > maxMb * 1024 * 1024) {
          queueMicrotask(() => update(i, { state: 'error', message: `Over the ${maxMb} MB limit.` }));
          return;
        }
        const xhr = new XMLHttpRequest();
        xhr.open('POST', `/api/records/${recordId}/attachments`);
        xhr.upload.onprogress = (e) => e.lengthComputable && update(i, { progress: e.loaded / e.total });
        xhr.onload = () => {
          if (xhr.status === 201) {
            update(i, { state: 'done', progress: 1 });
            try {
              const attachment = (JSON.parse(xhr.responseText) as { attachment: Added }).attachment;
              setAdded((a) => [...a, attachment]);
            } catch {
              // stored all the same; it shows with the other attachments next time the page is opened
            }
          } else {
            const message = apiErrorMessage(xhr.responseText) ?? `Upload failed (${xhr.status}).`;
            update(i, { state: 'error', message });
          }
        };
        xhr.onerror = () => update(i, { state: 'error', message: 'Could not reach the server.' });
        const form = new FormData();
        form.set('file', file);
        xhr.send(form);
      });
      return [...u, ...list.map((f) => ({ name: f.name, progress: 0, state: 'uploading' as const }))];
    });
  }

  return (
    <div className="flex flex-col gap-2">
      <DropZone onFiles={send} className="p-4 text-center text-sm">
        <p>Drop photos, PDFs, CSV logs or text files here, or</p>
        <button type="button" className="btn btn-quiet mt-2 text-sm" onClick={() => input.current?.click()}>
          Choose files…
        </button>
        <input
          ref={input}
          type="file"
          multiple
          className="sr-only"
          aria-label="Attach files"
          tabIndex={-1}
          accept="image/png,image/jpeg,image/gif,image/webp,application/pdf,text/csv,.csv,text/plain,.txt,.log"
          onChange={(e) => e.target.files && send(e.target.files)}
        />
        <p className="mt-2 text-xs text-muted">Up to {maxMb} MB each. The type is checked from the file’s contents.</p>
      </DropZone>
      <ul className="flex flex-col gap-2" aria-live="polite">
        {uploads.map((u, i) => (
          <li key={i} className="text-sm">
            <div className="flex justify-between gap-2">
              <span className="truncate">{u.name}</span>
              <span className="text-muted">
                {u.state === 'done' ? 'Uploaded' : u.state === 'error' ? 'Failed' : `${Math.round(u.progress * 100)} %`}
              </span>
            </div>
            <progress className="w-full" max={1} value={u.progress} aria-label={`Upload of ${u.name}`} />
            {u.message && <p className="field-error">{u.message}</p>}
          </li>
        ))}
      </ul>
      {added.length > 0 && (
        <section aria-label="Just attached" className="flex flex-col gap-3">
          {added.map((a) =>
            a.isImage ? (
              <figure key={a.id}>
                <img
                  src={a.url}
                  alt={`Attached image ${a.fileName}`}
                  className="max-h-[28rem] rounded border border-line"
                />
                <figcaption className="mt-1 text-sm text-muted">{a.fileName}</figcaption>
              </figure>
            ) : a.isCsv ? (
              <div key={a.id} className="card">
                <Suspense fallback={<p className="text-sm text-muted">Loading the plot of {a.fileName}…</p>}>
                  <CsvPreview url={a.url} name={a.fileName} />
                </Suspense>
              </div>
            ) : (
              <p key={a.id} className="text-sm">
                <a href={a.url} download={a.fileName}>
                  {a.fileName}
                </a>
              </p>
            ),
          )}
        </section>
      )}
    </div>
  );
}
