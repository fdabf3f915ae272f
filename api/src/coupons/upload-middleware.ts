/**
 * Receiving an upload: multer (disk storage, one file, small fields) with the
 * size limit applied twice: the declared Content-Length is refused before a
 * byte of the body is read, and multer stops a body that turns out larger.
 * Both give the import's own 413 error (csv_too_large).
 *
 * The file goes to a temporary file in a private folder (UPLOAD_TEMP_DIR, mode
 * 0700), never into memory: the import reads it from there as a stream. It is
 * removed when the request is done, whatever the answer: by the route once the
 * import has finished (discardReceivedFile), again (a no-op) when the response
 * closes, and by multer itself when it refuses the body part way.
 */
import { randomUUID } from 'node:crypto';
import { chmod, mkdir, readdir, rm, stat } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { badRequest } from '../http/errors.ts';
import { fileSourceFromPath, type CouponFileSource } from './coupon-file-source.ts';
import { MAX_UPLOAD_BYTES, tooLargeError } from './import.service.ts';

export const UPLOAD_TEMP_DIR = path.join(os.tmpdir(), 'plyledger-uploads');

/** Temporary files are named after the process (several API processes may share the folder) and a random id. */
export const TEMP_FILE_PREFIX = `${process.pid}-`;

/** Room for the multipart envelope and the form fields around the file. */
const ENVELOPE_BYTES = 256 * 1024;

const storage = multer.diskStorage({
  destination: (_req, _file, done) => {
    mkdir(UPLOAD_TEMP_DIR, { recursive: true, mode: 0o700 })
      .then(() => chmod(UPLOAD_TEMP_DIR, 0o700)) // made private even if it was there already
      .then(() => done(null, UPLOAD_TEMP_DIR), (err: Error) => done(err, UPLOAD_TEMP_DIR));
  },
  filename: (_req, _file, done) => done(null, `${TEMP_FILE_PREFIX}${randomUUID()}.upload`),
});

const receive = multer({
  storage,
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10, fieldSize: 64 * 1024, parts: 12 },
}).single('file');

export const receiveCouponFile: RequestHandler = (req, res, next) => {
  const declared = Number(req.headers['content-length']);
  if (Number.isFinite(declared) && declared > MAX_UPLOAD_BYTES + ENVELOPE_BYTES) return next(tooLargeError(declared));
  if (!req.is('multipart/form-data')) {
    return next(badRequest('Send the file as multipart/form-data with the field "file"', { problems: [{ field: 'file', message: 'no multipart body', fix: 'post a form with the CSV file in the field "file"' }] }));
  }
  receive(req, res, (err?: unknown) => {
    if (!err) {
      res.once('close', () => void discardReceivedFile(req));
      return next();
    }
    const e = err as { code?: string; field?: string };
    if (e.code === 'LIMIT_FILE_SIZE') return next(tooLargeError());
    if (e.code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest(`Send one file, in the field "file" (got field "${e.field}")`, { problems: [{ field: e.field ?? 'file', message: 'unexpected file field', fix: 'name the form field "file" and send one file' }] }));
    if (typeof e.code === 'string' && e.code.startsWith('LIMIT_')) return next(badRequest(`The form is not an upload form this route takes (${e.code})`, { problems: [{ field: e.field ?? 'form', message: e.code, fix: 'send the file and the mapping and unit fields only' }] }));
    // busboy: a body cut short or malformed (the client gave up, or is not a browser form)
    next(badRequest(`The upload could not be read as a multipart form (${(err as Error).message}); send it again`, { problems: [{ field: 'file', message: 'incomplete or malformed multipart body', fix: 'send the form again' }] }));
  });
};

/** busboy reads part file names as latin1; browsers send UTF-8. */
export function fileNameOf(original: string): string {
  const utf8 = Buffer.from(original, 'latin1').toString('utf8');
  const name = utf8.includes('\uFFFD') ? original : utf8;
  return name.replace(/[\\/]/g, '_').slice(0, 255) || 'upload.csv';
}

/** The received file as the import reads it. */
export function receivedFileSource(file: Express.Multer.File): CouponFileSource {
  return fileSourceFromPath(file.path, file.size);
}

/** Removes the request's temporary file (a no-op when it is gone already); never throws, so it cannot hide the answer. */
export async function discardReceivedFile(req: Request): Promise<void> {
  if (!req.file?.path) return;
  const file = req.file.path;
  await rm(file, { force: true }).catch((err: Error) => req.log?.warn({ file, reason: err.message }, 'upload: temporary file not removed'));
}

/** Temporary files older than this are left over from a process that stopped mid-upload. */
export const STALE_UPLOAD_MS = 3600_000;

/**
 * Removes temporary upload files older than `maxAgeMs` (any process's: a file
 * that old belongs to no request in flight, since a request is cut long
 * before). Run when an API process starts; returns how many it removed.
 */
export async function sweepStaleUploads(maxAgeMs = STALE_UPLOAD_MS, now = Date.now()): Promise<number> {
  const names = await readdir(UPLOAD_TEMP_DIR).catch(() => [] as string[]);
  let removed = 0;
  for (const name of names) {
    if (!name.endsWith('.upload')) continue;
    const file = path.join(UPLOAD_TEMP_DIR, name);
    const info = await stat(file).catch(() => undefined);
    if (info && now - info.mtimeMs > maxAgeMs) {
      await rm(file, { force: true }).catch(() => undefined);
      removed++;
    }
  }
  return removed;
}
