import { HttpErrorResponse } from '@angular/common/http';

import { Upload, UploadProblem } from '../../../shared/catalogue/coupon-wire';

/** The server's refusal of a whole file (POST /uploads error reply). */
export interface UploadRefusal {
  readonly status: number;
  readonly code: string;
  readonly message: string;
  readonly problems: readonly UploadProblem[];
  readonly problemCount: number | null;
  /** 409 csv_duplicate_file: the upload that imported the same bytes before. */
  readonly duplicateOf: Upload | null;
}

interface ErrorBody {
  readonly error?: {
    readonly code?: string;
    readonly message?: string;
    readonly details?: { readonly problems?: UploadProblem[]; readonly problemCount?: number; readonly upload?: Upload };
  };
}

/** Reads the refusal from whatever HttpClient threw. */
export function uploadRefusalOf(error: unknown): UploadRefusal {
  if (!(error instanceof HttpErrorResponse)) {
    return { status: -1, code: 'page', message: 'Something went wrong in the page; reload it and try again.', problems: [], problemCount: null, duplicateOf: null };
  }
  if (error.status === 0) {
    return { status: 0, code: 'no_answer', message: 'The server did not answer; nothing was stored. Check the connection and send the file again.', problems: [], problemCount: null, duplicateOf: null };
  }
  const body = (typeof error.error === 'object' ? error.error : null) as ErrorBody | null;
  const details = body?.error?.details;
  return {
    status: error.status,
    code: body?.error?.code ?? 'error',
    message: body?.error?.message ?? `The server answered ${error.status} ${error.statusText}`.trim(),
    problems: details?.problems ?? [],
    problemCount: details?.problemCount ?? null,
    duplicateOf: details?.upload ?? null,
  };
}
