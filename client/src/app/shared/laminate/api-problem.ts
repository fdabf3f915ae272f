import { HttpErrorResponse } from '@angular/common/http';

/** One problem of the API error shape `{ error: { code, message, details: { problems } } }`. */
export interface ApiProblem {
  readonly field: string;
  readonly message: string;
  readonly row?: number;
  /** 0-based character of the field's text (a laminate code) */
  readonly position?: number;
  readonly fix?: string;
}

export interface ApiFailure {
  readonly message: string;
  readonly problems: readonly ApiProblem[];
  readonly status: number;
}

/** What went wrong, in words the person can act on, from whatever HttpClient threw. */
export function apiFailureOf(error: unknown): ApiFailure {
  if (!(error instanceof HttpErrorResponse)) {
    return { message: 'Something went wrong in the page; the last good result is kept.', problems: [], status: -1 };
  }
  if (error.status === 0) {
    return { message: 'The server did not answer. Your edits are kept; they are sent again with your next change.', problems: [], status: 0 };
  }
  const body = error.error as { error?: { message?: string; details?: { problems?: ApiProblem[] } } } | null;
  const problems = body?.error?.details?.problems ?? [];
  const message = body?.error?.message ?? `The server answered ${error.status} ${error.statusText}`.trim();
  return { message, problems, status: error.status };
}

/** The 0-based character of the laminate code the API's problem points at, if it names one. */
export function codeErrorPosition(problem: ApiProblem): number | null {
  return problem.field === 'code' && Number.isInteger(problem.position) ? problem.position! : null;
}
