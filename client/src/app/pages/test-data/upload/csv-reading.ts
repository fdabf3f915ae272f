/**
 * Reading the chosen file in the browser with papaparse: the header, the first
 * rows for the preview, the number of rows, and what would make the server
 * refuse the whole file at once (not UTF-8, not comma-separated, empty).
 */
import { parse, type Parser, type ParseStepResult } from 'papaparse';

/** How many data rows the preview shows and checks. */
export const PREVIEW_ROWS = 20;

export interface FilePreview {
  readonly headers: readonly string[];
  /** The first data rows, blank lines included so row numbers match the server's. */
  readonly rows: readonly (readonly string[])[];
  /** Data rows of the whole file, blank lines not counted. */
  readonly rowCount: number;
  readonly delimiter: string;
  /** Reasons the server will refuse the file as it is; empty when none is seen. */
  readonly fileProblems: readonly string[];
}

const BYTE_ORDER_MARK = '\uFEFF';

/** Reads the whole file once (in chunks: files reach 25 MB), keeping only the header and the first rows. */
export function readFilePreview(file: File): Promise<FilePreview> {
  return new Promise((resolve, reject) => {
    let headers: string[] | null = null;
    const rows: string[][] = [];
    let rowCount = 0;
    let delimiter = ',';
    parse<string[]>(file, {
      header: false,
      skipEmptyLines: false,
      delimitersToGuess: [',', ';', '\t', '|'],
      step: (result: ParseStepResult<string[]>, parser: Parser) => {
        const cells = result.data;
        if (headers === null) {
          delimiter = result.meta.delimiter;
          headers = cells.map((cell, i) => (i === 0 ? cell.replace(BYTE_ORDER_MARK, '') : cell).trim());
          if (headers.some((h) => h.includes('\u0000'))) parser.abort();
          return;
        }
        const blank = cells.length === 1 && cells[0].trim() === '';
        if (!blank) rowCount++;
        if (rows.length < PREVIEW_ROWS) rows.push(cells);
      },
      complete: () => resolve(previewOf(headers ?? [], rows, rowCount, delimiter)),
      error: (error: Error) => reject(error),
    });
  });
}

function previewOf(headers: string[], rows: string[][], rowCount: number, delimiter: string): FilePreview {
  const fileProblems: string[] = [];
  if (headers.some((h) => h.includes('\u0000'))) {
    fileProblems.push('The file is not UTF-8 text (it looks like UTF-16). Save it as “CSV UTF-8 (comma delimited)”.');
  } else if (headers.length === 0 || headers.every((h) => h === '')) {
    fileProblems.push('The file is empty: it needs a header line and at least one coupon row.');
  } else if (rowCount === 0) {
    fileProblems.push('The file has a header but no coupon rows.');
  }
  if (delimiter !== ',' && headers.length > 1) {
    const name = delimiter === ';' ? 'semicolons' : delimiter === '\t' ? 'tabs' : `“${delimiter}”`;
    fileProblems.push(`The columns are separated by ${name}; Plyledger reads commas. Save the file as CSV (comma delimited).`);
  }
  return { headers, rows, rowCount, delimiter, fileProblems };
}
