/**
 * Checks on an uploaded file before any row is read: not empty, UTF-8 (a UTF-8
 * byte-order mark is accepted and dropped; UTF-16 and UTF-32 are refused with
 * the fix), no NUL byte, and comma-delimited (a semicolon or tab file is
 * refused, as spreadsheets in some locales write them, rather than guessed).
 *
 * The file is read as a stream, one chunk at a time, and never held whole. The
 * checks keep their order of precedence (empty, wide encoding, not UTF-8,
 * blank, NUL, delimiter): what is found on the way is only reported once the
 * whole file has decoded, so a bad byte near the end still wins over a NUL or
 * a semicolon header.
 */
import type { CouponFileSource } from './coupon-file-source.ts';
import { CsvImportError } from './csv-problems.ts';

function startsWith(content: Buffer, bytes: number[]): boolean {
  return bytes.every((b, i) => content[i] === b);
}

/** From the first four bytes (or fewer, for a shorter file). */
function wideEncodingOf(head: Buffer): string | undefined {
  if (startsWith(head, [0x00, 0x00, 0xfe, 0xff]) || startsWith(head, [0xff, 0xfe, 0x00, 0x00])) return 'UTF-32';
  if (startsWith(head, [0xff, 0xfe]) || startsWith(head, [0xfe, 0xff])) return 'UTF-16';
  // no mark, but every other byte zero in the first characters: UTF-16 without a BOM
  if (head.length >= 4 && (head[1] === 0 && head[3] === 0 || head[0] === 0 && head[2] === 0)) return 'UTF-16';
  return undefined;
}

/**
 * A UTF-8 validator fed chunk by chunk (RFC 3629, table of section 4: no
 * overlong forms, no surrogates, nothing above U+10FFFF), which names the row
 * of the first byte of the first invalid sequence. A sequence cut by a chunk
 * boundary is carried over to the next chunk.
 */
export class Utf8RowFinder {
  private row = 1;
  private sequenceRow = 1;
  private pending = 0;
  private low = 0x80;
  private high = 0xbf;

  /** Row of the first invalid sequence in this chunk, or undefined if the chunk is valid so far. */
  push(chunk: Uint8Array): number | undefined {
    for (const b of chunk) {
      if (this.pending) {
        if (b < this.low || b > this.high) return this.sequenceRow;
        this.pending--;
        this.low = 0x80;
        this.high = 0xbf;
        continue;
      }
      if (b < 0x80) {
        if (b === 0x0a) this.row++;
        continue;
      }
      this.sequenceRow = this.row;
      if (b >= 0xc2 && b <= 0xdf) this.pending = 1;
      else if (b >= 0xe0 && b <= 0xef) {
        this.pending = 2;
        if (b === 0xe0) this.low = 0xa0;
        if (b === 0xed) this.high = 0x9f;
      } else if (b >= 0xf0 && b <= 0xf4) {
        this.pending = 3;
        if (b === 0xf0) this.low = 0x90;
        if (b === 0xf4) this.high = 0x8f;
      } else return this.row;
    }
    return undefined;
  }

  /** Row of a sequence the file ends in the middle of, or undefined. */
  end(): number | undefined {
    return this.pending ? this.sequenceRow : undefined;
  }
}

/** Row of the first byte that is not UTF-8, reading the file again (only once the decoder has refused it). */
export async function rowOfFirstInvalidUtf8(source: CouponFileSource): Promise<number | undefined> {
  const finder = new Utf8RowFinder();
  for await (const chunk of source.open() as AsyncIterable<Buffer>) {
    const row = finder.push(chunk);
    if (row !== undefined) return row;
  }
  return finder.end();
}

/** What the text checks remember between chunks: whether anything is not blank, the first NUL, the first line. */
class TextFacts {
  nonBlank = false;
  nulRow: number | undefined;
  private newlines = 0;
  private inFirstLine = true;
  readonly firstLine = { comma: false, semicolon: false, tab: false };

  push(text: string) {
    if (!this.nonBlank && /\S/.test(text)) this.nonBlank = true;
    if (this.nulRow === undefined) {
      const nul = text.indexOf('\u0000');
      const upTo = nul >= 0 ? nul : text.length;
      for (let i = text.indexOf('\n'); i >= 0 && i < upTo; i = text.indexOf('\n', i + 1)) this.newlines++;
      if (nul >= 0) this.nulRow = this.newlines + 1;
    }
    if (this.inFirstLine) {
      const newline = text.indexOf('\n');
      const part = newline < 0 ? text : text.slice(0, newline);
      this.firstLine.comma ||= part.includes(',');
      this.firstLine.semicolon ||= part.includes(';');
      this.firstLine.tab ||= part.includes('\t');
      if (newline >= 0) this.inFirstLine = false;
    }
  }
}

function emptyFile(): CsvImportError {
  return new CsvImportError(400, 'csv_empty', 'The file is empty', [{ field: 'file', code: 'empty_file', message: 'the file has no content', fix: 'choose the CSV file with the coupon results' }]);
}

function notUtf8(row: number | undefined): CsvImportError {
  return new CsvImportError(400, 'csv_encoding', `The file is not valid UTF-8${row ? ` (first bad byte on row ${row})` : ''}; it may be in a legacy code page`, [
    { row, field: 'file', code: 'wrong_encoding', message: 'bytes that are not UTF-8 (a legacy code page such as Windows-1252?)', fix: 'save it again as "CSV UTF-8" (comma delimited)' },
  ]);
}

function checkHead(head: Buffer): void {
  const wide = wideEncodingOf(head);
  if (wide) {
    throw new CsvImportError(400, 'csv_encoding', `The file is encoded as ${wide}; Plyledger reads UTF-8`, [
      { row: 1, field: 'file', code: 'wrong_encoding', message: `the file starts with a ${wide} byte-order mark or pattern`, fix: 'save it again as "CSV UTF-8" (comma delimited)' },
    ]);
  }
}

function checkText(facts: TextFacts): void {
  if (!facts.nonBlank) throw new CsvImportError(400, 'csv_empty', 'The file has no rows', [{ field: 'file', code: 'empty_file', message: 'the file holds only blank space', fix: 'choose the CSV file with the coupon results' }]);
  // A NUL byte is valid UTF-8 but no text column in PostgreSQL can hold it: refuse the file, naming the row.
  if (facts.nulRow !== undefined) {
    const row = facts.nulRow;
    throw new CsvImportError(400, 'csv_binary', `The file holds a NUL byte (row ${row}); it is not a text CSV file`, [
      { row, field: 'file', code: 'nul_byte', message: 'a NUL (zero) byte, which text files do not contain', fix: 'export the data again as "CSV UTF-8" from the spreadsheet or the test machine' },
    ]);
  }
  const { comma, semicolon, tab } = facts.firstLine;
  if (!comma) {
    const other = semicolon ? 'semicolon' : tab ? 'tab' : undefined;
    if (other) {
      throw new CsvImportError(400, 'csv_delimiter', `The file is delimited by ${other}s; Plyledger reads comma-delimited CSV`, [
        { row: 1, field: 'file', code: 'wrong_delimiter', message: `the header line is separated by ${other}s, not commas`, fix: 'save it again as comma-delimited CSV (or change the list separator of the spreadsheet)' },
      ]);
    }
  }
}

/**
 * Reads the whole file once and throws a CsvImportError naming what is wrong
 * with it as a whole; `eachChunk` sees every byte on the way (the checksum).
 */
export async function checkCouponFile(source: CouponFileSource, eachChunk: (chunk: Buffer) => void = () => {}): Promise<void> {
  if (source.size === 0) throw emptyFile();
  const decoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false });
  const facts = new TextFacts();
  // The first bytes are held back until there are four of them: the wide-encoding check comes before decoding.
  let head: Buffer | undefined = Buffer.alloc(0);
  const decode = (bytes: Buffer | undefined) => {
    try {
      facts.push(bytes ? decoder.decode(bytes, { stream: true }) : decoder.decode());
      return true;
    } catch {
      return false;
    }
  };
  let valid = true;
  let read = 0;
  for await (const chunk of source.open() as AsyncIterable<Buffer>) {
    eachChunk(chunk);
    read += chunk.length;
    let bytes: Buffer = chunk;
    if (head) {
      head = Buffer.concat([head, chunk]);
      if (head.length < 4) continue;
      checkHead(head);
      bytes = head;
      head = undefined;
    }
    if (!(valid = decode(bytes))) break;
  }
  if (read === 0) throw emptyFile();
  if (head) {
    checkHead(head);
    valid = decode(head);
  }
  if (valid) valid = decode(undefined);
  if (!valid) throw notUtf8(await rowOfFirstInvalidUtf8(source));
  checkText(facts);
}

/**
 * The file's text, chunk by chunk, as the checks above accepted it (the UTF-8
 * byte-order mark dropped). A multi-byte character cut by a chunk boundary is
 * completed from the next chunk by the streaming decoder.
 */
export async function* couponFileText(source: CouponFileSource): AsyncGenerator<string> {
  const decoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false });
  for await (const chunk of source.open() as AsyncIterable<Buffer>) {
    const text = decoder.decode(chunk, { stream: true });
    if (text) yield text;
  }
  const rest = decoder.decode();
  if (rest) yield rest;
}
