/**
 * `plyledger basis [FILE]`: A- and B-basis values of a data group (or of
 * several conditions) by the handbook's decision flow, from JSON in FILE or on
 * standard input. The engine does the work; this file reads, calls, prints.
 */
import { analyseDataGroup } from '../../statistics/index.ts';
import { parseOptions, readJsonInput, UsageError, writeJson, type CliCommand } from '../command.ts';

const usage = `Usage: plyledger basis [FILE]

Computes A- and B-basis values (CMH-17-1G Vol. 1, chapter 8) of the values in
FILE (or standard input, or '-') and prints the result as JSON: the method
chosen by the decision flow, the basis values, and the diagnostics behind
them (outliers, batch-to-batch variability, distribution fits and their OSL,
nonparametric, ANOVA and pooled values, provisional status, warnings).

Input (JSON):
  {
    "values":     [number, ...],            measured values, one unit (e.g. MPa)
    "batches":    ["label", ...],           one batch label per value
    "conditions": ["label", ...],           optional: one condition per value; runs the pooled methods
    "basis":      "A" | "B" | "both",       default "both"
    "method":     "auto" | "normal" | "lognormal" | "weibull" | "nonparametric"
                  | "anova" | "pooled-sd" | "pooled-cv",   default "auto"
    "modifiedCv": true | false,             default false (CMH-17-1G Vol. 1 chapter 8)
    "exclusions": [{ "index": 3, "reason": "..." }]        optional, each with a reason
  }

Basis values are in the unit of the values; CVs are fractions (0.05 = 5 %).
A value that does not exist for the data is null, with a warning.
Exit codes: 0 done, 2 bad input (one line on standard error names the field).
`;

export const basisCommand: CliCommand = {
  name: 'basis',
  summary: 'A- and B-basis values of a data group by the CMH-17 decision flow',
  usage,
  async run(args, io) {
    const { positional } = parseOptions(args, {});
    if (positional.length > 1) throw new UsageError(`basis takes at most one FILE (got ${positional.length})`);
    const input = await readJsonInput(positional[0], io);
    writeJson(io, analyseDataGroup(input));
    return 0;
  },
};
