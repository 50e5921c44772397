// Receives one file from a multipart/form-data body as it streams in: busboy parses the parts, the file goes to a
// temporary file in the uploads folder while it is hashed and sniffed, and reading stops at the size limit. The
// whole upload is never in memory, however large it is or however it is sent (with a length or chunked).
import busboy from 'busboy';
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { ReadableStream as NodeReadableStream } from 'node:stream/web';
import { HttpError } from './http';
import { startSniffing, type Sniffed } from './filetype';
import { discardIncoming, incomingPath } from './storage';

interface ReceivedFile {
  /** The temporary file holding the bytes: move it with `keepIncoming` or drop it with `discardIncoming`. */
  path: string;
  /** The name the sender gave, as sent (not yet cleaned). */
  fileName: string;
  size: number;
  sha256: string;
  type: Sniffed;
}

interface ReceiveOptions {
  field: string;
  maxBytes: number;
  tooLarge: () => HttpError;
  noFile: () => HttpError;
}

/** Reads the body until the named file field has been written out; other fields and files are skipped. */
export async function receiveFile(request: Request, options: ReceiveOptions): Promise<ReceivedFile> {
  const contentType = request.headers.get('content-type') ?? '';
  if (!request.body || !/^multipart\/form-data\b/i.test(contentType)) throw options.noFile();
  let parser: busboy.Busboy;
  try {
    parser = busboy({
      headers: { 'content-type': contentType },
      // Browsers send the file name as raw UTF-8 inside the quotes.
      defParamCharset: 'utf8',
      limits: { fileSize: options.maxBytes, files: 1, fields: 20, parts: 25, fieldSize: 64 * 1024 },
    });
  } catch {
    throw options.noFile(); // no boundary, or not a form type busboy reads
  }
  const source = Readable.fromWeb(request.body as NodeReadableStream<Uint8Array>);

  return new Promise<ReceivedFile>((resolve, reject) => {
    let written: Promise<ReceivedFile> | null = null;
    let file: Readable | null = null;
    let settled = false;
    const fail = (error: unknown) => {
      if (settled) return;
      settled = true;
      // Stops pulling the body: destroying the source cancels the request's stream.
      source.unpipe(parser);
      source.destroy();
      process.nextTick(() => parser.destroy());
      file?.destroy(error instanceof Error ? error : undefined);
      // A file already written out in full (the failure came after it) is dropped too.
      written?.then(
        (received) => discardIncoming(received.path),
        () => undefined,
      );
      reject(error instanceof Error ? error : new Error('The upload failed.', { cause: error }));
    };
    const unreadable = () => new HttpError(400, 'invalid_input', 'The upload could not be read; please send it again.');

    parser.on('file', (name, stream, info) => {
      if (name !== options.field || written || settled) {
        stream.resume(); // drained and ignored
        return;
      }
      file = stream;
      // busboy emits 'limit' in the middle of its own bookkeeping: fail once it has returned.
      stream.once('limit', () => process.nextTick(() => fail(options.tooLarge())));
      written = writeIncoming(stream, info.filename ?? 'file');
      written.catch(fail);
    });
    parser.once('error', () => fail(unreadable()));
    parser.once('close', () => {
      if (settled) return;
      if (!written) return fail(options.noFile());
      written.then((received) => {
        if (settled) return;
        settled = true;
        resolve(received);
      }, fail);
    });
    source.once('error', () => fail(unreadable()));
    source.pipe(parser);
  });
}

/**
 * Writes one file stream to a new temporary file, hashing and sniffing each chunk on the way; removes it on failure.
 * `check` (given the size so far and the chunk's length) may stop the writing with an error.
 */
async function writeIncoming(
  stream: Readable,
  fileName: string,
  check: (size: number, added: number) => Error | null = () => null,
): Promise<ReceivedFile> {
  const path = incomingPath();
  const hash = createHash('sha256');
  const sniffer = startSniffing();
  let size = 0;
  const tap = new Transform({
    transform(chunk: Buffer, _encoding, done) {
      hash.update(chunk);
      sniffer.push(chunk);
      size += chunk.byteLength;
      done(check(size, chunk.byteLength), chunk);
    },
  });
  try {
    await pipeline(stream, tap, createWriteStream(path, { flags: 'wx' }));
    return { path, fileName, size, sha256: hash.digest('hex'), type: await sniffer.finish(fileName) };
  } catch (e) {
    discardIncoming(path);
    throw e;
  }
}

interface ReceivedPart {
  path: string;
  fileName: string;
  size: number;
  sha256: string;
}

interface ReceiveManyOptions {
  field: string;
  /** The most bytes one file may have; `maxBytesFor` may lower it by the file's name. */
  maxBytes: number;
  maxBytesFor: (fileName: string) => number;
  /** The most bytes all files together may have. */
  maxTotalBytes: number;
  maxFiles: number;
  /** Answers for a file over its limit, all files over the total, or too many files. */
  tooLarge: (why: 'file' | 'total' | 'count', fileName: string) => HttpError;
  noFile: () => HttpError;
}

/**
 * Reads a multipart body with many files in one field (and a few small text fields), writing each file to its own
 * temporary file as it streams in. A file over its limit, the files together over theirs, or one file too many stop
 * the reading at once and remove everything written so far.
 */
export async function receiveFiles(
  request: Request,
  options: ReceiveManyOptions,
): Promise<{ files: ReceivedPart[]; fields: Record<string, string> }> {
  const contentType = request.headers.get('content-type') ?? '';
  if (!request.body || !/^multipart\/form-data\b/i.test(contentType)) throw options.noFile();
  let parser: busboy.Busboy;
  try {
    parser = busboy({
      headers: { 'content-type': contentType },
      defParamCharset: 'utf8',
      limits: {
        fileSize: options.maxBytes,
        files: options.maxFiles,
        fields: 20,
        parts: options.maxFiles + 20,
        fieldSize: 64 * 1024,
      },
    });
  } catch {
    throw options.noFile();
  }
  const source = Readable.fromWeb(request.body as NodeReadableStream<Uint8Array>);
  const fields: Record<string, string> = {};
  const writes: Promise<ReceivedPart>[] = [];
  let total = 0;

  return new Promise((resolve, reject) => {
    let settled = false;
    const current = new Set<Readable>();
    const fail = (error: unknown) => {
      if (settled) return;
      settled = true;
      source.unpipe(parser);
      source.destroy();
      process.nextTick(() => parser.destroy());
      for (const f of current) f.destroy();
      for (const w of writes)
        w.then(
          (part) => discardIncoming(part.path),
          () => undefined,
        );
      reject(error instanceof Error ? error : new Error('The upload failed.', { cause: error }));
    };
    const unreadable = () => new HttpError(400, 'invalid_input', 'The upload could not be read; please send it again.');

    parser.on('field', (name, value) => {
      if (!(name in fields)) fields[name] = value;
    });
    parser.on('file', (name, stream, info) => {
      if (name !== options.field || settled) {
        stream.resume();
        return;
      }
      const fileName = info.filename ?? 'file';
      const limit = Math.min(options.maxBytes, options.maxBytesFor(fileName));
      current.add(stream);
      stream.once('limit', () => process.nextTick(() => fail(options.tooLarge('file', fileName))));
      const write = writeIncoming(stream, fileName, (size, added) => {
        total += added;
        if (size > limit) return options.tooLarge('file', fileName);
        if (total > options.maxTotalBytes) return options.tooLarge('total', fileName);
        return null;
      }).then(({ path, size, sha256 }) => {
        current.delete(stream);
        return { path, fileName, size, sha256 };
      });
      writes.push(write);
      write.catch(fail);
    });
    parser.on('filesLimit', () => process.nextTick(() => fail(options.tooLarge('count', ''))));
    parser.once('error', () => fail(unreadable()));
    parser.once('close', () => {
      if (settled) return;
      Promise.all(writes).then((files) => {
        if (settled) return;
        settled = true;
        resolve({ files, fields });
      }, fail);
    });
    source.once('error', () => fail(unreadable()));
    source.pipe(parser);
  });
}
