import type { ApiFailure } from '../../../shared/laminate/api-problem';

/** The API's problems that name a ply (`plies[3].thetaDeg`), by 0-based ply index, for the table rows. */
export function plyProblemsOf(failure: ApiFailure | null): ReadonlyMap<number, string> {
  const byPly = new Map<number, string>();
  for (const problem of failure?.problems ?? []) {
    const match = /^plies\[(\d+)\]\.?(.*)$/.exec(problem.field);
    if (!match) continue;
    const index = Number(match[1]);
    const text = `${match[2] || 'ply'}: ${problem.message}${problem.fix ? ` (${problem.fix})` : ''}`;
    byPly.set(index, byPly.has(index) ? `${byPly.get(index)}; ${text}` : text);
  }
  return byPly;
}
