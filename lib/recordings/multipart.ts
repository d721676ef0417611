// Streams a multipart/form-data request through busboy: every `file` part is spooled to disk (hashed and counted
// on the way), text fields are collected. Limits come from the environment; hitting one stops reading the body and
// answers 413 (a file too large) or 400 (too many files or fields).
import { rm } from 'node:fs/promises';
import { Readable } from 'node:stream';
import type { ReadableStream as WebReadableStream } from 'node:stream/web';
import busboy from 'busboy';
import { HttpError, PayloadTooLargeError } from '@/lib/http';
import { spoolUpload, type SpooledFile } from '@/lib/storage/spool';

export interface UploadLimits {
  maxFileBytes: number;
  maxFiles: number;
}

export interface ReceivedFile extends SpooledFile {
  filename: string;
}

export interface ReceivedForm {
  fields: Record<string, string>;
  files: ReceivedFile[];
}

const MAX_FIELDS = 30;
const MAX_FIELD_BYTES = 1024 * 1024; // a layout or profile JSON is a few KB

export { PayloadTooLargeError };

export class BadUploadError extends HttpError {
  constructor(code: string, message: string) {
    super(400, code, message);
  }
}

/** 200 MB, 512 KB, 900 bytes: sizes in limit messages. */
function megabytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;
  if (bytes >= 1024) return `${Math.round((bytes / 1024) * 10) / 10} KB`;
  return `${bytes} bytes`;
}

/** The name the file had on the uploader's machine, without any folder part, at most 255 characters. */
function cleanFilename(name: string | undefined): string {
  const base = (name ?? '').split(/[\\/]/).pop()?.replace(/[\u0000-\u001f]/g, '').trim() ?? '';
  return (base || 'recording.csv').slice(0, 255);
}

export async function readMultipart(request: Request, limits: UploadLimits, spoolDir: string): Promise<ReceivedForm> {
  const contentType = request.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data/i.test(contentType)) {
    throw new BadUploadError('not_multipart', 'Send the files as multipart/form-data (fields athleteId, file, ...).');
  }
  // A declared length beyond every file at its limit plus the fields cannot succeed: refuse before reading it.
  const declared = Number(request.headers.get('content-length') ?? NaN);
  const ceiling = limits.maxFiles * limits.maxFileBytes + MAX_FIELDS * MAX_FIELD_BYTES;
  if (Number.isFinite(declared) && declared > ceiling) {
    throw new PayloadTooLargeError(
      `The upload is ${megabytes(declared)}; at most ${limits.maxFiles} files of ${megabytes(limits.maxFileBytes)} each are accepted (MAX_UPLOAD_BYTES).`,
    );
  }
  if (!request.body) throw new BadUploadError('no_file', 'The request has no body; add at least one file part named "file".');

  let parser: busboy.Busboy;
  try {
    parser = busboy({
      headers: { 'content-type': contentType },
      // Browsers and fetch send the file name as raw UTF-8 in filename="..."; busboy's default reads it as latin1.
      defParamCharset: 'utf8',
      limits: { fileSize: limits.maxFileBytes, files: limits.maxFiles, fields: MAX_FIELDS, fieldSize: MAX_FIELD_BYTES },
    });
  } catch (error) {
    throw new BadUploadError('bad_multipart', `The multipart body cannot be read: ${(error as Error).message}`);
  }
  const body = Readable.fromWeb(request.body as unknown as WebReadableStream<Uint8Array>);
  const fields: Record<string, string> = {};
  const files: ReceivedFile[] = [];
  const pending: Promise<void>[] = [];
  let failure: Error | null = null;
  const open = new Set<Readable>();

  const result = new Promise<ReceivedForm>((resolve, reject) => {
    const fail = (error: Error) => {
      if (failure) return;
      failure = error;
      body.unpipe(parser);
      // No more parts: busboy may still be inside the chunk that held the bad field and would announce the next file
      // part, whose stream then never ends because the body was cut off (the request hung, its spool file stayed).
      parser.removeAllListeners('file');
      parser.on('file', (_name: string, stream: Readable) => stream.resume());
      // A body over the size limit is cut off (the answer says "Connection: close"); any other refused body is
      // read to its end, up to 8 MB, so the client gets the answer on a connection it can keep using.
      if (error instanceof PayloadTooLargeError) body.destroy();
      else drain(body);
      for (const stream of open) stream.destroy(error); // ends each spool with an error, which removes its file
      reject(error);
    };
    parser.on('field', (name, value, info) => {
      if (info.valueTruncated) fail(new PayloadTooLargeError(`The field "${name}" is longer than ${megabytes(MAX_FIELD_BYTES)}.`));
      else fields[name] = value;
    });
    parser.on('file', (name, stream, info) => {
      if (failure) {
        stream.resume();
        return;
      }
      if (name !== 'file') {
        stream.resume();
        fail(new BadUploadError('unexpected_part', `Unexpected file part "${name}"; send each recording as a part named "file".`));
        return;
      }
      const filename = cleanFilename(info.filename);
      open.add(stream);
      stream.on('error', () => undefined); // a stream destroyed after its spool finished has no other listener
      stream.on('close', () => open.delete(stream));
      stream.on('limit', () =>
        fail(new PayloadTooLargeError(`The file "${filename}" is larger than the limit of ${megabytes(limits.maxFileBytes)} per file (MAX_UPLOAD_BYTES).`)),
      );
      pending.push(
        spoolUpload(stream, spoolDir).then(
          (spooled) => {
            open.delete(stream);
            if (failure || (stream as unknown as { truncated?: boolean }).truncated) {
              void rm(spooled.path, { force: true });
              return;
            }
            files.push({ ...spooled, filename });
          },
          (error: Error) => fail(failure ?? new BadUploadError('upload_interrupted', `The file "${filename}" did not arrive completely: ${error.message}`)),
        ),
      );
    });
    parser.on('filesLimit', () => fail(new BadUploadError('too_many_files', `At most ${limits.maxFiles} files can be sent in one upload (MAX_UPLOAD_FILES).`)));
    parser.on('fieldsLimit', () => fail(new BadUploadError('too_many_fields', `At most ${MAX_FIELDS} form fields are accepted.`)));
    parser.on('error', (error: Error) => fail(new BadUploadError('bad_multipart', `The multipart body cannot be read: ${error.message}`)));
    body.on('error', (error: Error) => fail(new BadUploadError('upload_interrupted', `The upload stopped before it was complete: ${error.message}`)));
    parser.on('close', () => {
      void Promise.all(pending).then(() => {
        if (failure) return;
        resolve({ fields, files });
      });
    });
  });
  body.pipe(parser);
  try {
    return await result;
  } catch (error) {
    await Promise.allSettled(pending);
    await Promise.all(files.map((f) => rm(f.path, { force: true })));
    throw error;
  }
}

const DISCARD_LIMIT = 8 * 1024 * 1024;

/** Reads the rest of a Node stream into nothing, cutting it off after 8 MB. */
function drain(body: Readable): void {
  let seen = 0;
  body.on('error', () => undefined);
  body.on('data', (chunk: Buffer) => {
    seen += chunk.length;
    if (seen > DISCARD_LIMIT) body.destroy();
  });
  body.resume();
}

/**
 * Reads and drops the body of a request refused before its body was read (401/403), up to 8 MB, so the client that
 * is still sending gets the answer instead of a reset connection. A larger body is cut off.
 */
export async function discardBody(request: Request): Promise<void> {
  if (!request.body || request.bodyUsed) return;
  const reader = request.body.getReader();
  let seen = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      seen += value.byteLength;
      if (seen > DISCARD_LIMIT) {
        await reader.cancel();
        return;
      }
    }
  } catch {
    // the client went away: nothing to answer
  }
}
