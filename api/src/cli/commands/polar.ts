/** `plyledger polar [FILE]`: engineering constants of a laminate turned from 0 to 180° (engine: api/src/laminate). */
import { parsePolarInput, polarStiffness } from '../../laminate/index.ts';
import { type CliCommand, parseOptions, readJsonInput, UsageError, writeJson } from '../command.ts';

export const polarCommand: CliCommand = {
  name: 'polar',
  summary: 'Ex, Ey, Gxy, nu_xy of a laminate turned from 0 to 180 degrees',
  usage: `Usage: plyledger polar [--step DEG] [FILE]

Reads a laminate as JSON from FILE (or standard input), "plies" or "code" +
"material" + "plyThickness" as for \`plyledger laminate\`, with optional
"stepDeg" (default 1). --step overrides it.
Prints { stepDeg, points: [{ angleDeg, Ex, Ey, Gxy, nuxy, flexural }] } in MPa.
`,
  async run(args, io) {
    const { options, positional } = parseOptions(args, { step: 'value' });
    if (positional.length > 1) throw new UsageError('give at most one FILE');
    const json = await readJsonInput(positional[0], io);
    if (options.step !== undefined && json && typeof json === 'object' && !Array.isArray(json)) {
      const step = Number(options.step);
      if (!Number.isFinite(step)) throw new UsageError(`--step needs a number of degrees, not ${options.step}`);
      (json as Record<string, unknown>).stepDeg = step;
    }
    const input = parsePolarInput(json);
    writeJson(io, polarStiffness(input.plies, { stepDeg: input.stepDeg }));
    return 0;
  },
};
