/**
 * From the laminate command's input (the same JSON as `plyledger laminate`
 * and POST /laminates/analyze) to what the section writers and checks take:
 * the engine's stiffness and constants, the ply list and the engine version.
 */
import { analyseLaminate, ENGINE_VERSION, parseLaminateInput } from '../laminate/index.ts';
import type { SectionSource } from './types.ts';

/** Validates the laminate input (throws InputError naming the field) and runs the laminate engine on it. */
export function sectionSourceFromLaminateInput(json: unknown): SectionSource {
  const input = parseLaminateInput(json);
  const analysis = analyseLaminate({ ...input, loads: null, criteria: [], progressive: false });
  return {
    stiffness: analysis,
    plies: input.plies,
    engineVersion: analysis.engineVersion ?? ENGINE_VERSION,
    engineeringConstants: {
      membrane: { ...analysis.membrane },
      flexural: { ...analysis.flexural },
    },
  };
}
