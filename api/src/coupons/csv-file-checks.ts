/**
 * Checks on an uploaded file before any row is read: not empty, UTF-8 (a UTF-8
 * byte-order mark is accepted and dropped; UTF-16 and UTF-32 are refused with
 * the fix), and comma-delimited (a semicolon or tab file is refused, as
 * spreadsheets in some locales write them, rather than guessed).
 */
import { CsvImportError } from './csv-problems.ts';

const UTF8_BOM = [0xef, 0xbb, 0xbf];

function startsWith(content: Buffer, bytes: number[]): boolean {
  return bytes.every((b, i) => content[i] === b);
}

function wideEncodingOf(content: Buffer): string | undefined {
  if (startsWith(content, [0x00, 0x00, 0xfe, 0xff]) || startsWith(content, [0xff, 0xfe, 0x00, 0x00])) return 'UTF-32';
  if (startsWith(content, [0xff, 0xfe]) || startsWith(content, [0xfe, 0xff])) return 'UTF-16';
  // no mark, but every other byte zero in the first characters: UTF-16 without a BOM
  if (content.length >= 4 && (content[1] === 0 && content[3] === 0 || content[0] === 0 && content[2] === 0)) return 'UTF-16';
  return undefined;
}

/** Byte offset of the first invalid UTF-8 sequence (RFC 3629), or -1. */
export function firstInvalidUtf8(content: Buffer): number {
  let i = 0;
  while (i < content.length) {
    const b = content[i];
    const length = b < 0x80 ? 1 : (b & 0xe0) === 0xc0 && b >= 0xc2 ? 2 : (b & 0xf0) === 0xe0 ? 3 : (b & 0xf8) === 0xf0 && b <= 0xf4 ? 4 : 0;
    if (length === 0 || i + length > content.length) return i;
    for (let k = 1; k < length; k++) if ((content[i + k] & 0xc0) !== 0x80) return i;
    i += length;
  }
  return -1;
}

function rowOfByte(content: Buffer, offset: number): number {
  let row = 1;
  for (let i = 0; i < offset; i++) if (content[i] === 0x0a) row++;
  return row;
}

/** The file as text, or a CsvImportError naming what is wrong with it as a whole. */
export function decodeCouponFile(content: Buffer): string {
  if (content.length === 0) throw new CsvImportError(400, 'csv_empty', 'The file is empty', [{ field: 'file', code: 'empty_file', message: 'the file has no content', fix: 'choose the CSV file with the coupon results' }]);
  const wide = wideEncodingOf(content);
  if (wide) {
    throw new CsvImportError(400, 'csv_encoding', `The file is encoded as ${wide}; Plyledger reads UTF-8`, [
      { row: 1, field: 'file', code: 'wrong_encoding', message: `the file starts with a ${wide} byte-order mark or pattern`, fix: 'save it again as "CSV UTF-8" (comma delimited)' },
    ]);
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(content);
  } catch {
    const at = firstInvalidUtf8(startsWith(content, UTF8_BOM) ? content.subarray(3) : content);
    const row = at >= 0 ? rowOfByte(content, at + (startsWith(content, UTF8_BOM) ? 3 : 0)) : undefined;
    throw new CsvImportError(400, 'csv_encoding', `The file is not valid UTF-8${row ? ` (first bad byte on row ${row})` : ''}; it may be in a legacy code page`, [
      { row, field: 'file', code: 'wrong_encoding', message: 'bytes that are not UTF-8 (a legacy code page such as Windows-1252?)', fix: 'save it again as "CSV UTF-8" (comma delimited)' },
    ]);
  }
  if (text.trim() === '') throw new CsvImportError(400, 'csv_empty', 'The file has no rows', [{ field: 'file', code: 'empty_file', message: 'the file holds only blank space', fix: 'choose the CSV file with the coupon results' }]);
  // A NUL byte is valid UTF-8 but no text column in PostgreSQL can hold it: refuse the file, naming the row.
  const nul = text.indexOf('\u0000');
  if (nul >= 0) {
    const row = text.slice(0, nul).split(/\r?\n/).length;
    throw new CsvImportError(400, 'csv_binary', `The file holds a NUL byte (row ${row}); it is not a text CSV file`, [
      { row, field: 'file', code: 'nul_byte', message: 'a NUL (zero) byte, which text files do not contain', fix: 'export the data again as "CSV UTF-8" from the spreadsheet or the test machine' },
    ]);
  }
  const newline = text.search(/\r?\n/);
  const firstLine = newline < 0 ? text : text.slice(0, newline);
  if (!firstLine.includes(',')) {
    const other = firstLine.includes(';') ? 'semicolon' : firstLine.includes('\t') ? 'tab' : undefined;
    if (other) {
      throw new CsvImportError(400, 'csv_delimiter', `The file is delimited by ${other}s; Plyledger reads comma-delimited CSV`, [
        { row: 1, field: 'file', code: 'wrong_delimiter', message: `the header line is separated by ${other}s, not commas`, fix: 'save it again as comma-delimited CSV (or change the list separator of the spreadsheet)' },
      ]);
    }
  }
  return text;
}
