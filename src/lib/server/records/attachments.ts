import { eq } from 'drizzle-orm';
import { db } from '../db/client';
import { attachments, records } from '../db/schema';
import { HttpError, notFound } from '../http';
import { newId } from '../ids';
import { recordAudit } from '../audit';
import { settings } from '../config';
import { sniffType } from '../filetype';
import { storeBytes, openStored } from '../storage';
import { attachmentView, type AttachmentView } from './view';
import { loadForWrite } from './write';
import type { Role } from '../../domain';

export function maxUploadBytes(): number {
  return settings().WAKEBOOK_MAX_UPLOAD_MB * 1024 * 1024;
}

function cleanName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? 'file';
  const cleaned = base
    .replace(/[\u0000-\u001f\u007f"<>|:*?]/g, '_')
    .trim()
    .slice(0, 180);
  return cleaned || 'file';
}

/** Reads the multipart body within the size limit, checks the type from the bytes and stores the file. */
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
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    throw new HttpError(400, 'invalid_input', 'Send the file as multipart/form-data in a field named “file”.', [
      { path: 'file', message: 'No file was received.' },
    ]);
  }
  const file = form.get('file');
  if (!file || typeof file === 'string')
    throw new HttpError(400, 'invalid_input', 'Choose a file to upload.', [
      { path: 'file', message: 'No file was received.' },
    ]);
  if (file.size > limit) throw tooLarge();
  if (file.size === 0)
    throw new HttpError(400, 'invalid_input', 'That file is empty.', [{ path: 'file', message: 'The file is empty.' }]);
  const bytes = new Uint8Array(await file.arrayBuffer());
  const fileName = cleanName(file.name);
  const type = sniffType(bytes, fileName);
  if (!type)
    throw new HttpError(415, 'unsupported_type', 'Attach photos (PNG, JPEG, GIF, WebP), PDFs, CSV logs or plain text.');
  const { sha256, size } = storeBytes(bytes);
  const id = newId();
  db()
    .insert(attachments)
    .values({
      id,
      recordId,
      fileName,
      contentType: type.contentType,
      size,
      sha256,
      uploadedById: actor.id,
      createdAt: new Date(),
    })
    .run();
  recordAudit({
    actor,
    action: 'record.attachment',
    targetType: 'record',
    targetId: recordId,
    detail: { attachment: id, fileName, size },
  });
  return attachmentView(db().select().from(attachments).where(eq(attachments.id, id)).get()!);
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
