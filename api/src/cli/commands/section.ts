/** `plyledger section --format F [FILE]`: a laminate's shell section in a solver's syntax (engine: api/src/sections). */
import { exportSection, isSectionFormat, SECTION_FORMATS, UNIT_SYSTEM_NAMES, type SectionOptions, type UnitSystemName } from '../../sections/index.ts';
import { sectionSourceFromLaminateInput } from '../../sections/source.ts';
import { type CliCommand, parseOptions, readJsonInput, UsageError } from '../command.ts';

function integerOption(value: string | boolean | undefined, flag: string): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  if (!Number.isInteger(n)) throw new UsageError(`--${flag} needs a whole number, not ${value}`);
  return n;
}

function textOption(value: string | boolean | undefined): string | undefined {
  return typeof value === 'string' ? value : undefined;
}

export const sectionCommand: CliCommand = {
  name: 'section',
  summary: 'shell section of a laminate for a solver (Nastran, CalculiX, general stiffness, JSON, CSV)',
  usage: `Usage: plyledger section --format <${SECTION_FORMATS.join(' | ')}>
         [--units ${UNIT_SYSTEM_NAMES.join('|')}] [--elset NAME] [--pid N] [--mid N]
         [--offset R] [--free-field] [--name TEXT] [--revision TEXT]
         [--allowables TEXT] [--date YYYY-MM-DD] [FILE]

Reads a laminate as JSON from FILE (or standard input), the same input as
\`plyledger laminate\` ("plies", or "code" + "material" + "plyThickness", in
MPa and mm), and prints its section in the chosen format on standard output:
  nastran-pcomp    PCOMP with one MAT8 per ply material (bulk data)
  nastran-pshell   PSHELL with MAT2 membrane, bending, shear, coupling (bulk data)
  calculix         *MATERIAL/*ORIENTATION/*SHELL SECTION, COMPOSITE for *INCLUDE
  general-shell    *SHELL GENERAL SECTION (6x6 ABD) and *TRANSVERSE SHEAR STIFFNESS
  json, csv        A, B, D, H, constants, plies and units

Options:
  --units       unit system of the file (default N-mm-t)
  --elset       element set of keyword sections (default LAMINATE)
  --pid, --mid  Nastran property id and first material id (default 1)
  --offset      reference surface (nodes) from the mid-plane along the normal,
                in thicknesses: -0.5 bottom, 0 mid-plane (default), 0.5 top
  --free-field  Nastran free field instead of small field
  --name, --revision, --allowables, --date   header text
Every file starts with a header: product, engine version, layup, allowables,
units, date and the caution that results support, not replace, judgement.
`,
  async run(args, io) {
    const { options, positional } = parseOptions(args, {
      format: 'value', units: 'value', elset: 'value', pid: 'value', mid: 'value', offset: 'value',
      'free-field': 'boolean', name: 'value', revision: 'value', allowables: 'value', date: 'value',
    });
    if (positional.length > 1) throw new UsageError('give at most one FILE');
    const format = options.format;
    if (typeof format !== 'string') throw new UsageError(`--format is required: ${SECTION_FORMATS.join(', ')}`);
    if (!isSectionFormat(format)) throw new UsageError(`--format ${format} is not one of ${SECTION_FORMATS.join(', ')}`);
    let referenceOffset: number | undefined;
    if (options.offset !== undefined) {
      referenceOffset = Number(options.offset);
      if (!Number.isFinite(referenceOffset)) throw new UsageError(`--offset needs a number of thicknesses, not ${options.offset}`);
    }
    const sectionOptions: SectionOptions = {
      units: textOption(options.units) as UnitSystemName | undefined,
      elset: textOption(options.elset),
      propertyId: integerOption(options.pid, 'pid'),
      materialId: integerOption(options.mid, 'mid'),
      referenceOffset,
      freeField: options['free-field'] === true,
      layupName: textOption(options.name),
      layupRevision: textOption(options.revision),
      allowables: textOption(options.allowables),
      date: textOption(options.date),
    };
    const source = sectionSourceFromLaminateInput(await readJsonInput(positional[0], io));
    io.stdout(exportSection(format, source, sectionOptions).text);
    return 0;
  },
};
