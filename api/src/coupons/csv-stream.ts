/**
 * The rows of a CSV text, one at a time, as an async iterator: papaparse reads
 * the text in chunks and pauses after each until the consumer (which awaits
 * database inserts between batches) asks for more, so the rows of a large file
 * are never all held at once.
 */
import Papa from 'papaparse';

export interface CsvRecord {
  /** Row as a spreadsheet numbers it (header = 1), counting blank lines too. */
  row: number;
  cells: string[];
}

const CHUNK_CHARACTERS = 256 * 1024;

export async function* csvRecords(text: string): AsyncGenerator<CsvRecord> {
  const chunks: string[][][] = [];
  let parser: Papa.Parser | undefined;
  let finished = false;
  let wake: (() => void) | undefined;
  Papa.parse<string[]>(text, {
    delimiter: ',',
    header: false,
    skipEmptyLines: false,
    chunkSize: CHUNK_CHARACTERS,
    chunk: (results: Papa.ParseResult<string[]>, handle: Papa.Parser) => {
      chunks.push(results.data);
      parser = handle;
      handle.pause();
      wake?.();
    },
    complete: () => {
      finished = true;
      wake?.();
    },
  });
  let row = 0;
  try {
    while (true) {
      const chunk = chunks.shift();
      if (chunk) {
        for (const cells of chunk) {
          row++;
          yield { row, cells };
        }
        if (!finished) parser?.resume();
        continue;
      }
      if (finished) return;
      await new Promise<void>((resolve) => (wake = resolve));
      wake = undefined;
    }
  } finally {
    // the consumer stopped early (row limit, error): let the parser go
    if (!finished) parser?.abort();
  }
}

/** A record that is a blank line. */
export function isBlank(cells: string[]): boolean {
  return cells.length === 0 || (cells.length === 1 && cells[0].trim() === '');
}
