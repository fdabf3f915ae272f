/**
 * The one error type for input that cannot be computed on, shared by the
 * engines (which stay free of HTTP) and the layers that call them. The HTTP
 * layer turns it into a 400 with the API error shape; the CLI into exit code 2.
 *
 * `field` is a path into the input (`plies[3].material.E2`, `values[12]`), `row`
 * a 1-based row of an uploaded file where there is one, `position` a 0-based
 * character within the field's text where there is one, and `fix` tells the
 * user what to change.
 */
export interface InputProblem {
  field: string;
  message: string;
  row?: number;
  /** 0-based character of the field's text the problem is at (a laminate code), so a client can mark it */
  position?: number;
  fix?: string;
}

export class InputError extends Error {
  readonly problems: InputProblem[];

  constructor(problems: InputProblem | InputProblem[], summary?: string) {
    const list = Array.isArray(problems) ? problems : [problems];
    super(summary ?? describeProblem(list[0]) + (list.length > 1 ? ` (and ${list.length - 1} more)` : ''));
    this.name = 'InputError';
    this.problems = list;
  }
}

export function describeProblem(problem: InputProblem | undefined): string {
  if (!problem) return 'invalid input';
  const where = problem.row !== undefined ? `row ${problem.row}, ${problem.field}` : problem.field;
  return `${where}: ${problem.message}${problem.fix ? `; ${problem.fix}` : ''}`;
}
