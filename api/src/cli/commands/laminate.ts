/** `plyledger laminate [FILE]`: the full laminate analysis (engine: api/src/laminate). */
import { analyseLaminate, parseLaminateInput } from '../../laminate/index.ts';
import { type CliCommand, parseOptions, readJsonInput, UsageError, writeJson } from '../command.ts';

export const laminateCommand: CliCommand = {
  name: 'laminate',
  summary: 'ABD, engineering constants, ply stresses, failure and design rules of a laminate',
  usage: `Usage: plyledger laminate [--progressive] [FILE]

Reads a laminate as JSON from FILE (or standard input) and prints its analysis.
Input, in internal units (MPa, mm, N/mm, N·mm/mm, °C):
  { "plies": [{ "material": { "E1", "E2", "G12", "nu12", "G13"?, "G23"?, "density"?,
                "alpha1"?, "alpha2"?, "beta1"?, "beta2"?, "Xt"?, "Xc"?, "Yt"?, "Yc"?,
                "S12"?, "S23"?, "e1t"?, "e1c"?, "e2t"?, "e2c"?, "g12"? },
                "thetaDeg", "thickness" }]
    or "code": "[0/±45/90]s" with one "material" and "plyThickness",
    "loads"?: { "N": [Nx, Ny, Nxy], "M": [Mx, My, Mxy], "deltaT"?, "deltaMoisture"?,
                "midplaneStrain"?: [εx|null, εy|null, γxy|null], "curvature"?: [...] },
    "criteria"?: ["max-stress", "max-strain", "tsai-hill", "tsai-wu", "hashin", "puck"],
    "factorOfSafety"?, "tsaiWu"?: { "F12Star" }, "puck"?: { "pPerpParTension",
    "pPerpParCompression", "pPerpPerpCompression" },
    "transverseShear"?: { "model": "correction-factor" | "parabolic", "correctionFactor" },
    "progressive"? }
Compressive strengths are positive magnitudes. The first ply is the bottom one.

Options:
  --progressive   also run ply-discount progressive failure to last-ply failure
`,
  async run(args, io) {
    const { options, positional } = parseOptions(args, { progressive: 'boolean' });
    if (positional.length > 1) throw new UsageError('give at most one FILE');
    const json = await readJsonInput(positional[0], io);
    if (options.progressive && json && typeof json === 'object' && !Array.isArray(json)) (json as Record<string, unknown>).progressive = true;
    writeJson(io, analyseLaminate(parseLaminateInput(json)));
    return 0;
  },
};
