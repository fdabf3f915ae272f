import { HttpErrorResponse } from '@angular/common/http';

/** One problem of the API error shape `{ error: { code, message, details: { problems } } }`. */
export interface ApiProblem {
  readonly field: string;
  readonly message: string;
  readonly row?: number;
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

/**
 * The 0-based character the stacking-code parser complains about: its messages
 * read `position N of "…": …` with N counted from 1 (api/src/laminate/stacking-code.ts).
 */
export function codeErrorPosition(problem: ApiProblem): number | null {
  if (problem.field !== 'code') return null;
  const match = /position (\d+) of/.exec(problem.message);
  return match ? Number(match[1]) - 1 : null;
}
