/**
 * Receiving an upload: multer (memory storage, one file, small fields) with
 * the size limit applied twice: the declared Content-Length is refused before
 * a byte of the body is read, and multer stops a body that turns out larger.
 * Both give the import's own 413 error (csv_too_large).
 */
import type { RequestHandler } from 'express';
import multer from 'multer';
import { badRequest } from '../http/errors.ts';
import { MAX_UPLOAD_BYTES, tooLargeError } from './import.service.ts';

/** Room for the multipart envelope and the form fields around the file. */
const ENVELOPE_BYTES = 256 * 1024;

const receive = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10, fieldSize: 64 * 1024, parts: 12 },
}).single('file');

export const receiveCouponFile: RequestHandler = (req, res, next) => {
  const declared = Number(req.headers['content-length']);
  if (Number.isFinite(declared) && declared > MAX_UPLOAD_BYTES + ENVELOPE_BYTES) return next(tooLargeError(declared));
  if (!req.is('multipart/form-data')) {
    return next(badRequest('Send the file as multipart/form-data with the field "file"', { problems: [{ field: 'file', message: 'no multipart body', fix: 'post a form with the CSV file in the field "file"' }] }));
  }
  receive(req, res, (err?: unknown) => {
    if (!err) return next();
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
