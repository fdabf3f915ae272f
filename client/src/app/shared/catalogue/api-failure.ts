import { apiFailureOf, ApiFailure } from '../laminate/api-problem';

/**
 * What went wrong with a catalogue request, in words the person can act on.
 * The API error shape is read by the one reader (shared/laminate/api-problem);
 * only the messages for "no answer" and page errors differ here, because these
 * pages keep nothing to send again.
 */
export function catalogueFailureOf(error: unknown): ApiFailure {
  const failure = apiFailureOf(error);
  if (failure.status === 0) return { ...failure, message: 'The server did not answer. Check the connection and try again.' };
  if (failure.status === -1) return { ...failure, message: 'Something went wrong in the page; reload it and try again.' };
  return failure;
}

/** One line: the message, then each problem as "field: message (fix)". */
export function failureText(failure: ApiFailure): string {
  const problems = failure.problems.map((p) => `${p.field}: ${p.message}${p.fix ? ` (${p.fix})` : ''}`);
  return [failure.message, ...problems].join(' — ');
}
