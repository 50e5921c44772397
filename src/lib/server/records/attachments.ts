import { eq } from 'drizzle-orm';
import { db } from '../db/client';
import { attachments, records } from '../db/schema';
import { HttpError, notFound } from '../http';
import { newId } from '../ids';
import { recordAudit } from '../audit';
import { settings } from '../config';
import { cutFileName } from '../../file-names';
import { receiveFile } from '../multipart';
import { discardIncoming, keepIncoming, openStored } from '../storage';
import { attachmentView, type AttachmentView } from './view';
import { loadForWrite } from './write';
import type { Role } from '../../domain';

export function maxUploadBytes(): number {
  return settings().WAKEBOOK_MAX_UPLOAD_MB * 1024 * 1024;
}

export function cleanName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? 'file';
  const cleaned = base.replace(/[\u0000-\u001f\u007f"<>|:*?]/g, '_').trim();
  return cutFileName(cleaned) || 'file';
}

const noFile = () =>
  new HttpError(400, 'invalid_input', 'Send the file as multipart/form-data in a field named “file”.', [
    { path: 'file', message: 'No file was received.' },
  ]);

/**
 * Streams the multipart body to a temporary file within the size limit (stopping at it), checks the type from the
 * bytes, and only then moves the file into place and records it. The temporary file is removed on any failure.
 */
export async function uploadAttachment(
  recordId: string,
  request: Request,
  actor: { id: string; email: string; role: Role },
): Promise<AttachmentView> {
  loadForWrite(recordId, actor, 'attachment:upload');
  const limit = maxUploadBytes();
  const tooLarge = () =>
    new HttpError(413, 'too_large', `Attachments may be at most ${settings().WAKEBOOK_MAX_UPLOAD_MB} MB.`);
  const declared = Number(request.headers.get('content-length') ?? '0');
  // Multipart framing adds a little; anything well over the limit is refused before reading it.
  if (declared > limit + 64 * 1024) throw tooLarge();
  const file = await receiveFile(request, { field: 'file', maxBytes: limit, tooLarge, noFile });
  let kept = false;
  try {
    if (file.size === 0)
      throw new HttpError(400, 'invalid_input', 'That file is empty.', [
        { path: 'file', message: 'The file is empty.' },
      ]);
    if (!file.type)
      throw new HttpError(
        415,
        'unsupported_type',
        'Attach photos (PNG, JPEG, GIF, WebP), PDFs, CSV logs or plain text.',
      );
    const fileName = cleanName(file.fileName);
    keepIncoming(file.path, file.sha256);
    kept = true;
    const id = newId();
    db()
      .insert(attachments)
      .values({
        id,
        recordId,
        fileName,
        contentType: file.type.contentType,
        size: file.size,
        sha256: file.sha256,
        uploadedById: actor.id,
        createdAt: new Date(),
      })
      .run();
    recordAudit({
      actor,
      action: 'record.attachment',
      targetType: 'record',
      targetId: recordId,
      detail: { attachment: id, fileName, size: file.size },
    });
    return attachmentView(db().select().from(attachments).where(eq(attachments.id, id)).get()!);
  } finally {
    if (!kept) discardIncoming(file.path);
  }
}

/** Streams an attachment back byte for byte; images inline, everything else as a download. */
export function attachmentResponse(id: string): Response {
  const a = db()
    .select({ a: attachments, deleted: records.deletedAt })
    .from(attachments)
    .innerJoin(records, eq(records.id, attachments.recordId))
    .where(eq(attachments.id, id))
    .get();
  if (!a || a.deleted) throw notFound('That attachment');
  const stored = openStored(a.a.sha256);
  if (!stored) throw notFound('That attachment’s file');
  const inline = a.a.contentType.startsWith('image/');
  const encoded = encodeURIComponent(a.a.fileName);
  return new Response(stored.stream, {
    status: 200,
    headers: {
      'content-type': a.a.contentType.startsWith('text/') ? `${a.a.contentType}; charset=utf-8` : a.a.contentType,
      'content-length': String(stored.size),
      'content-disposition': `${inline ? 'inline' : 'attachment'}; filename="${a.a.fileName.replace(/[^\x20-\x7e]/g, '_').replace(/"/g, '')}"; filename*=UTF-8''${encoded}`,
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, max-age=3600',
      'content-security-policy': "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
    },
  });
}
