/**
 * What is wrong with an uploaded file: one problem per row and column, with
 * the reason and the fix, and the error that carries them to the client. The
 * top-level code says which kind of failure it was (csv_empty, csv_encoding,
 * csv_delimiter, csv_wrong_header, csv_missing_columns, csv_invalid_mapping,
 * csv_invalid_rows, csv_duplicate_file, csv_too_large, csv_too_many_rows).
 */
import { ApiError } from '../http/errors.ts';

export interface CsvProblem {
  /** Row of the file as a spreadsheet numbers it: the header is row 1, the first coupon row 2. */
  row?: number;
  /** The file's column header. */
  column?: string;
  /** The template field (or request field) concerned. */
  field: string;
  /** Stable identifier of the reason, e.g. not_a_number, duplicate_in_file. */
  code: string;
  message: string;
  fix?: string;
}

/** At most this many problems are listed; the count of all of them is given beside. */
export const MAX_PROBLEMS_LISTED = 1000;

export class CsvImportError extends ApiError {
  constructor(status: number, code: string, message: string, problems: CsvProblem[], extra: Record<string, unknown> = {}) {
    super(status, code, message, { problems: problems.slice(0, MAX_PROBLEMS_LISTED), problemCount: problems.length, ...extra });
    this.name = 'CsvImportError';
  }
}

/** Collects problems, keeping the first MAX_PROBLEMS_LISTED and counting all. */
export class ProblemCollector {
  readonly list: CsvProblem[] = [];
  length = 0;

  push(...problems: CsvProblem[]): number {
    for (const p of problems) {
      if (this.list.length < MAX_PROBLEMS_LISTED) this.list.push(p);
      this.length++;
    }
    return this.length;
  }
}
