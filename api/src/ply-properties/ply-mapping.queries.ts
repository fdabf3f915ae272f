/** SQL on ply_field_mappings: the mapping a material states, where it differs from the default. */
import type { Knex } from 'knex';

export interface MappingRow {
  material_id: number;
  lamina_field: string;
  test_method_id: number;
  property_code: string;
  quantity: string;
}

export function selectMapping(db: Knex, materialId: number): Promise<MappingRow[]> {
  return db('ply_field_mappings').where({ material_id: materialId }).select('*');
}

export async function replaceMapping(db: Knex, materialId: number, rows: Omit<MappingRow, 'material_id'>[]): Promise<void> {
  await db('ply_field_mappings').where({ material_id: materialId }).delete();
  if (rows.length) await db('ply_field_mappings').insert(rows.map((r) => ({ ...r, material_id: materialId })));
}
