/** `plyledger envelope [FILE]`: first-ply failure envelope of a laminate (engine: api/src/laminate). */
import { failureEnvelope, parseEnvelopeInput } from '../../laminate/index.ts';
import { type CliCommand, parseOptions, readJsonInput, UsageError, writeJson } from '../command.ts';

export const envelopeCommand: CliCommand = {
  name: 'envelope',
  summary: 'first-ply failure envelope of a laminate in (Nx, Ny) or (Nx, Nxy)',
  usage: `Usage: plyledger envelope [--criterion NAME] [--axes Nx-Ny|Nx-Nxy] [--points N] [FILE]

Reads a laminate as JSON from FILE (or standard input), "plies" or "code" +
"material" + "plyThickness" as for \`plyledger laminate\`, with optional
"criterion" (default tsai-wu), "axes" (default Nx-Ny), "points" (load
directions over 360°, default 360), "deltaT", "deltaMoisture" (residual stress
held fixed), "tsaiWu", "puck". Options override the file.
Prints { criterion, axes, thickness, points: [{ angleDeg, strengthRatio,
N: [N/mm, N/mm], stress: [MPa, MPa], ply, surface, mode }] }.
`,
  async run(args, io) {
    const { options, positional } = parseOptions(args, { criterion: 'value', axes: 'value', points: 'value' });
    if (positional.length > 1) throw new UsageError('give at most one FILE');
    const json = await readJsonInput(positional[0], io);
    if (json && typeof json === 'object' && !Array.isArray(json)) {
      const obj = json as Record<string, unknown>;
      if (options.criterion !== undefined) obj.criterion = options.criterion;
      if (options.axes !== undefined) obj.axes = options.axes;
      if (options.points !== undefined) {
        const points = Number(options.points);
        if (!Number.isInteger(points)) throw new UsageError(`--points needs a whole number, not ${options.points}`);
        obj.points = points;
      }
    }
    writeJson(io, failureEnvelope(parseEnvelopeInput(json)));
    return 0;
  },
};
