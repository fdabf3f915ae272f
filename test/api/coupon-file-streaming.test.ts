/**
 * The upload read as a stream (issue 8: memory bounded by a chunk, not by the
 * file): the file checks and the CSV rows fed in small chunks, with the
 * boundaries where they hurt (inside a UTF-8 sequence, inside a quoted cell),
 * and through the real stack a file of several stored pieces, downloaded byte
 * for byte, the temporary files removed and a refused import leaving no piece.
 */
import { expect } from 'chai';
import { createHash } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, readdir, rm, stat, utimes, writeFile } from 'node:fs/promises';
import path from 'node:path';
import Papa from 'papaparse';
import { fileSourceFromBuffer } from '../../api/src/coupons/coupon-file-source.ts';
import { checkCouponFile, couponFileText } from '../../api/src/coupons/csv-file-checks.ts';
import { CsvImportError } from '../../api/src/coupons/csv-problems.ts';
import { csvRecords } from '../../api/src/coupons/csv-stream.ts';
import { importCouponFile, MAX_UPLOAD_BYTES, UPLOAD_CHUNK_BYTES } from '../../api/src/coupons/import.service.ts';
import { STALE_UPLOAD_MS, sweepStaleUploads, TEMP_FILE_PREFIX, UPLOAD_TEMP_DIR } from '../../api/src/coupons/upload-middleware.ts';
import type { SessionUser } from '../../api/src/http/request-user.ts';
import { testDb } from '../support/stack.ts';
import { couponRows, createMaterial, csvOf, importTableCounts, session, upload } from './coupon-chain-helpers.ts';

interface Refusal {
  code: string;
  message: string;
  problems: Array<{ row?: number; code: string }>;
}

/** The file checks' refusal of `content` read in chunks of `chunkBytes`, or undefined when they accept it. */
async function refusal(content: Buffer, chunkBytes: number): Promise<Refusal | undefined> {
  try {
    await checkCouponFile(fileSourceFromBuffer(content, chunkBytes));
    return undefined;
  } catch (err) {
    if (!(err instanceof CsvImportError)) throw err;
    return { code: err.code, message: err.message, problems: (err.details as { problems: Refusal['problems'] }).problems };
  }
}

async function textOf(content: Buffer, chunkBytes: number): Promise<string> {
  let text = '';
  for await (const part of couponFileText(fileSourceFromBuffer(content, chunkBytes))) text += part;
  return text;
}

async function* inPieces(text: string, size: number): AsyncGenerator<string> {
  for (let at = 0; at < text.length; at += size) yield text.slice(at, at + size);
}

describe('coupon file read in chunks (checks and rows)', function () {
  const lines = ['specimen_id,laboratory', 'S-1,Lab A', 'S-2,Laboratoire Besançon', 'S-3,Lab C', ''].join('\n');

  it('finds a Windows-1252 byte on its row wherever the chunk boundaries fall', async () => {
    const latin1 = Buffer.from(lines, 'latin1');
    const bad = latin1.indexOf(0xe7);
    expect(bad).to.be.greaterThan(0);
    for (const chunkBytes of [1, 2, 3, bad, bad + 1, 7, 64]) {
      const err = await refusal(latin1, chunkBytes);
      expect(err?.code, `chunks of ${chunkBytes}`).to.equal('csv_encoding');
      expect(err?.problems[0].row, `chunks of ${chunkBytes}`).to.equal(3);
    }
  });

  it('finds a sequence cut short across a chunk boundary (lead byte at the end of one chunk, a comma after it)', async () => {
    // E2 82 starts a 3-byte sequence (as in the euro sign E2 82 AC); the comma cannot continue it
    const content = Buffer.concat([Buffer.from('a,b\nc,d\ne,'), Buffer.from([0xe2, 0x82]), Buffer.from(',f\n')]);
    for (const chunkBytes of [1, 2, 10, 11, 12]) {
      const err = await refusal(content, chunkBytes);
      expect(err?.problems[0].row, `chunks of ${chunkBytes}`).to.equal(3);
    }
    const truncatedAtEnd = Buffer.concat([Buffer.from('a,b\nc,d\n'), Buffer.from([0xe2, 0x82])]);
    expect((await refusal(truncatedAtEnd, 3))?.problems[0].row, 'a file ending inside a sequence').to.equal(3);
  });

  it('accepts UTF-8 characters cut by a chunk boundary and gives back the exact text, the byte-order mark dropped', async () => {
    const utf8 = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(`${lines}S-4,Prüfstelle 東京 💥\n`, 'utf8')]);
    for (const chunkBytes of [1, 2, 3, 5, 64]) {
      expect(await refusal(utf8, chunkBytes), `chunks of ${chunkBytes}`).to.equal(undefined);
      expect(await textOf(utf8, chunkBytes), `chunks of ${chunkBytes}`).to.equal(`${lines}S-4,Prüfstelle 東京 💥\n`);
    }
  });

  it('keeps the whole-file checks and their order when read one byte at a time', async () => {
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(lines, 'utf16le')]);
    expect((await refusal(utf16, 1))?.message).to.match(/UTF-16/);
    expect((await refusal(Buffer.from(lines.replace('S-2', 'S-\u00002'), 'utf8'), 1))?.problems[0].row, 'NUL on row 3').to.equal(3);
    expect((await refusal(Buffer.from(lines.replace(/,/g, ';'), 'utf8'), 1))?.code).to.equal('csv_delimiter');
    expect((await refusal(Buffer.from(' \r\n \r\n', 'utf8'), 1))?.code).to.equal('csv_empty');
    // a bad byte at the end beats the semicolon header at the start, as in a whole-file read
    const both = Buffer.concat([Buffer.from(lines.replace(/,/g, ';'), 'utf8'), Buffer.from([0xe7])]);
    expect((await refusal(both, 4))?.code).to.equal('csv_encoding');
  });

  it('parses the same rows from text chunks as papaparse from the whole text, quoted cells and CRLF across boundaries', async () => {
    const text = 'id,note,value\r\nA-1,"two\r\nlines",1.5\r\nA-2,"a ""quoted"" word, and a comma",2\r\n\r\nA-3,,3\r\nA-4,"unclosed';
    const whole = Papa.parse<string[]>(text, { delimiter: ',' }).data;
    for (const size of [1, 2, 5, 13, 1000]) {
      const records = [];
      for await (const r of csvRecords(inPieces(text, size))) records.push(r);
      expect(records.map((r) => r.cells), `pieces of ${size}`).to.deep.equal(whole);
      expect(records.map((r) => r.row), `pieces of ${size}`).to.deep.equal(whole.map((_, i) => i + 1));
    }
  });
});

describe('coupon upload streamed: stored pieces, download, temporary files', function () {
  this.timeout(120_000);
  let material: { id: number; code: string };
  before(async () => {
    material = await createMaterial();
  });

  async function ownTempFiles(): Promise<string[]> {
    try {
      return (await readdir(UPLOAD_TEMP_DIR)).filter((name) => name.startsWith(TEMP_FILE_PREFIX));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return [];
      throw err;
    }
  }

  /** About 1.5 MiB of good rows: two stored pieces. */
  const largeFile = () => csvOf(couponRows(material.code, { batches: 3, perBatch: 4000 }));

  it('stores a file of more than 1 MiB in pieces and downloads it byte for byte, its SHA-256 the stored one', async () => {
    const csv = Buffer.from(largeFile(), 'utf8');
    expect(csv.length).to.be.within(1.2 * UPLOAD_CHUNK_BYTES, 2 * UPLOAD_CHUNK_BYTES);
    const before = await importTableCounts();
    const { status, body } = await upload(csv, { fileName: 'two-pieces.csv' });
    expect(status, JSON.stringify(body).slice(0, 500)).to.equal(201);
    expect(body.upload.sizeBytes).to.equal(csv.length);
    expect((await importTableCounts()).uploadChunks - before.uploadChunks).to.equal(2);
    const pieces = await testDb()('upload_chunks').where({ upload_id: body.upload.id }).orderBy('seq').select('seq', testDb().raw('octet_length(bytes)::int as n'));
    expect(pieces).to.deep.equal([{ seq: 0, n: UPLOAD_CHUNK_BYTES }, { seq: 1, n: csv.length - UPLOAD_CHUNK_BYTES }]);

    const res = await (await session('viewer')).api(`/api/v1/uploads/${body.upload.id}/file`);
    expect(res.status).to.equal(200);
    expect(res.headers.get('content-type')).to.match(/text\/csv/);
    expect(res.headers.get('content-disposition')).to.include('two-pieces.csv');
    const downloaded = Buffer.from(await res.arrayBuffer());
    expect(downloaded.length).to.equal(csv.length);
    expect(downloaded.equals(csv), 'the download is the file sent').to.equal(true);
    const stored = await testDb()('uploads').where({ id: body.upload.id }).first('sha256');
    expect(createHash('sha256').update(downloaded).digest('hex')).to.equal(stored.sha256).and.to.equal(body.upload.sha256);
  });

  it('leaves no temporary file after a good upload, a refused one and one stopped by the size limit; the folder is private', async () => {
    expect(await ownTempFiles(), 'before').to.deep.equal([]);
    expect((await upload(csvOf(couponRows(material.code, { batches: 1, perBatch: 2 })))).status).to.equal(201);
    expect(await ownTempFiles(), 'after a good upload').to.deep.equal([]);
    expect((await stat(UPLOAD_TEMP_DIR)).mode & 0o777, 'folder mode').to.equal(0o700);

    const rows = couponRows(material.code, { batches: 1, perBatch: 3 });
    rows[2].thickness_mm = -1;
    const refused = await upload(csvOf(rows));
    expect(refused.body.error?.code).to.equal('csv_invalid_rows');
    expect(await ownTempFiles(), 'after a refused upload').to.deep.equal([]);

    // declared size under the limit with the envelope, the file itself over it: multer stops it on disk
    const overLimit = Buffer.alloc(MAX_UPLOAD_BYTES + 64 * 1024, Buffer.from(`${'x'.repeat(99)}\n`));
    const tooLarge = await upload(overLimit);
    expect(tooLarge.status).to.equal(413);
    expect(tooLarge.body.error.code).to.equal('csv_too_large');
    expect(await ownTempFiles(), 'after the size limit').to.deep.equal([]);
  });

  it('a file refused on its last row, after a full stored piece of good rows, leaves no piece and no row', async () => {
    const rows = couponRows(material.code, { batches: 3, perBatch: 4000 });
    rows[rows.length - 1].strength_mpa = 'n/a';
    const before = await importTableCounts();
    const { status, body } = await upload(csvOf(rows));
    expect(status).to.equal(400);
    expect(body.error.details.problems[0]).to.include({ row: rows.length + 1, code: 'not_a_number' });
    expect(await importTableCounts()).to.deep.equal(before);
  });

  it('rolls back the stored pieces when the import fails after writing them (the upload row refused)', async () => {
    // batches and panels registered by a first file, so the second registers nothing and fails only at the upload row
    const first = await upload(csvOf(couponRows(material.code, { batches: 3, perBatch: 1 })));
    expect(first.status).to.equal(201);
    const csv = Buffer.from(largeFile(), 'utf8');
    const before = await importTableCounts();
    const nobody: SessionUser = { id: 2_000_000_000, name: 'No such person', email: 'nobody@example.invalid', roles: ['materials-engineer'] };
    const failure = await importCouponFile(testDb(), nobody, { fileName: 'rolled-back.csv', source: fileSourceFromBuffer(csv) }).then(() => undefined, (err: unknown) => err as { code?: string; constraint?: string });
    expect(failure?.code, 'a foreign-key violation').to.equal('23503');
    expect(failure?.constraint, 'on the upload row (written after the pieces)').to.match(/uploaded_by/);
    expect(await importTableCounts(), 'nothing stored').to.deep.equal(before);
  });
});

describe('temporary upload files left by a stopped process', () => {
  it('are removed when older than the limit; a file of a request in flight (recent) is kept', async () => {
    await mkdir(UPLOAD_TEMP_DIR, { recursive: true, mode: 0o700 });
    const old = path.join(UPLOAD_TEMP_DIR, `999999-stale-${Date.now()}.upload`);
    const fresh = path.join(UPLOAD_TEMP_DIR, `999999-fresh-${Date.now()}.upload`);
    await writeFile(old, 'left behind');
    await writeFile(fresh, 'in flight');
    const hoursAgo = new Date(Date.now() - 2 * STALE_UPLOAD_MS);
    await utimes(old, hoursAgo, hoursAgo);
    try {
      expect(await sweepStaleUploads()).to.be.at.least(1);
      expect(existsSync(old), 'the stale file').to.equal(false);
      expect(existsSync(fresh), 'the recent file').to.equal(true);
    } finally {
      await rm(fresh, { force: true });
      await rm(old, { force: true });
    }
  });
});
