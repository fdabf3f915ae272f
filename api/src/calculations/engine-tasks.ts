/**
 * Every engine call the API makes, by name: each takes the request body as it
 * came (the engines validate it) and returns plain data, so it can run in a
 * worker thread or inline alike.
 */
import { analyseLaminate, failureEnvelope, parseEnvelopeInput, parseLaminateInput, parsePolarInput, polarStiffness } from '../laminate/index.ts';
import { analyseDataGroup } from '../statistics/index.ts';
import { runSectionCheck, runSectionExport } from './sections-request.ts';

export const engineTasks = {
  'statistics.basis': (input: unknown) => analyseDataGroup(input),
  'laminate.analyse': (input: unknown) => analyseLaminate(parseLaminateInput(input)),
  'laminate.envelope': (input: unknown) => failureEnvelope(parseEnvelopeInput(input)),
  'laminate.polar': (input: unknown) => {
    const parsed = parsePolarInput(input);
    return polarStiffness(parsed.plies, { stepDeg: parsed.stepDeg });
  },
  'sections.export': (input: unknown) => runSectionExport(input as { format: string; body: unknown }),
  'sections.check': (input: unknown) => runSectionCheck(input as { check: string; body: unknown }),
} satisfies Record<string, (input: unknown) => unknown>;

export type EngineTaskName = keyof typeof engineTasks;
