/** `plyledger check strip|plate [FILE]`: the built-in checks of a laminate's section (engine: api/src/sections). */
import { plateCheck, stripCantileverCheck } from '../../sections/index.ts';
import { sectionSourceFromLaminateInput } from '../../sections/source.ts';
import { type CliCommand, parseOptions, readJsonInput, UsageError, writeJson } from '../command.ts';

function numberOption(value: string | boolean | undefined, flag: string, fallback: number): number {
  if (value === undefined) return fallback;
  const n = Number(value);
  if (typeof value !== 'string' || !Number.isFinite(n)) throw new UsageError(`--${flag} needs a number, not ${value}`);
  return n;
}

export const checkCommand: CliCommand = {
  name: 'check',
  summary: 'built-in checks of a section: laminated strip cantilever, simply supported plate',
  usage: `Usage: plyledger check strip [--width MM] [--length MM] [--load N] [--elements N] [FILE]
       plyledger check plate [--a MM] [--b MM] [--pressure MPA] [--ritz-terms N] [FILE]

Reads a laminate as JSON from FILE (or standard input), the same input as
\`plyledger laminate\`, and prints the check as JSON (mm, N, MPa):
  strip   a strip of the laminate clamped at one end, a force at the other:
          Euler-Bernoulli beam elements (cubic Hermite) with EI = width / d11
          against the closed form; deflection and rotation at every node and
          the ratio of the two. Defaults: width 25, length 200, load 10, 10 elements.
  plate   a simply supported a x b plate under uniform pressure: the Navier
          double series (specially orthotropic) and Rayleigh-Ritz with D16, D26
          kept; centre deflection of each, terms, convergence and the ratio;
          warnings when D16, D26 or B are not negligible. Defaults: a 300,
          b 200, pressure 0.01, 14 Ritz terms a direction.
`,
  async run(args, io) {
    const { options, positional } = parseOptions(args, {
      width: 'value', length: 'value', load: 'value', elements: 'value',
      a: 'value', b: 'value', pressure: 'value', 'ritz-terms': 'value',
    });
    const [which, file, ...rest] = positional;
    if (which !== 'strip' && which !== 'plate') throw new UsageError('say which check: strip or plate');
    if (rest.length) throw new UsageError('give at most one FILE');
    const source = sectionSourceFromLaminateInput(await readJsonInput(file, io));
    if (which === 'strip') {
      writeJson(io, stripCantileverCheck(source.stiffness, {
        widthMm: numberOption(options.width, 'width', 25),
        lengthMm: numberOption(options.length, 'length', 200),
        tipLoadN: numberOption(options.load, 'load', 10),
        elements: numberOption(options.elements, 'elements', 10),
      }));
    } else {
      writeJson(io, plateCheck(source.stiffness, {
        aMm: numberOption(options.a, 'a', 300),
        bMm: numberOption(options.b, 'b', 200),
        pressureMPa: numberOption(options.pressure, 'pressure', 0.01),
        ritzTerms: numberOption(options['ritz-terms'], 'ritz-terms', 14),
      }));
    }
    return 0;
  },
};
