/**
 * The rows of a CSV text, one at a time, as an async iterator, from a stream of
 * text chunks: each chunk is parsed by papaparse's parser as it arrives, and
 * the line it ends in the middle of (or a quoted cell that goes on into the
 * next chunk) is carried over and parsed again with the next one, as
 * papaparse's own chunk streamer does. The next chunk is only read when the
 * consumer (which awaits database inserts between batches) asks for more rows,
 * so neither the text nor the rows of a large file are ever all held at once.
 */
import Papa from 'papaparse';

export interface CsvRecord {
  /** Row as a spreadsheet numbers it (header = 1), counting blank lines too. */
  row: number;
  cells: string[];
}

/** papaparse's guess of the line ending (\r\n, \n or \r) from the first text, as Papa.parse makes it (ParserHandle is not in its type definitions). */
function guessLineEnding(text: string): string {
  const { ParserHandle } = Papa as unknown as { ParserHandle: new (config: object) => { guessLineEndings(input: string, quoteChar: string): string } };
  return new ParserHandle({}).guessLineEndings(text, '"');
}

export async function* csvRecords(chunks: AsyncIterable<string>): AsyncGenerator<CsvRecord> {
  let parser: Papa.Parser | undefined;
  let carried = '';
  let row = 0;
  const parse = (text: string, final: boolean) => {
    parser ??= new Papa.Parser({ delimiter: ',', newline: guessLineEnding(text) as Papa.ParseConfig['newline'], quoteChar: '"' });
    // cursor: where the rows it returned end; past it is the unfinished line (none when final)
    const results = parser.parse(text, 0, !final) as Papa.ParseResult<string[]>;
    carried = final ? '' : text.slice(results.meta.cursor);
    return results.data;
  };
  for await (const chunk of chunks) {
    // the line ending is guessed once the text holds one whole (a \r may be the start of \r\n)
    if (!parser && !/\n|\r[^]/.test(carried + chunk)) {
      carried += chunk;
      continue;
    }
    for (const cells of parse(carried + chunk, false)) yield { row: ++row, cells };
  }
  if (carried || !parser) {
    for (const cells of parse(carried, true)) yield { row: ++row, cells };
  }
}

/** A record that is a blank line. */
export function isBlank(cells: string[]): boolean {
  return cells.length === 0 || (cells.length === 1 && cells[0].trim() === '');
}
