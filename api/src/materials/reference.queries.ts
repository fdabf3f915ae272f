/**
 * SQL on the reference lists: test_properties, test_methods with
 * test_method_properties, and conditions.
 */
import type { Knex } from 'knex';

export interface TestMethodRow {
  id: number;
  code: string;
  standard_ref: string;
  title: string;
  properties: Array<{ property: string; dominance: string }>;
}

export interface ConditionRow {
  id: number;
  code: string;
  label: string;
  temperature_c: number;
  moisture_state: string;
}

export function selectTestProperties(db: Knex): Promise<Array<{ code: string; label: string }>> {
  return db('test_properties').orderBy(['sort_order', 'code']).select('code', 'label');
}

export function selectTestMethods(db: Knex): Promise<TestMethodRow[]> {
  return db('test_methods as m')
    .leftJoin('test_method_properties as p', 'p.test_method_id', 'm.id')
    .groupBy('m.id')
    .orderBy('m.code')
    .select(
      'm.id', 'm.code', 'm.standard_ref', 'm.title',
      db.raw(`coalesce(json_agg(json_build_object('property', p.property_code, 'dominance', p.dominance) order by p.property_code)
              filter (where p.property_code is not null), '[]') as properties`),
    );
}

export async function insertTestMethod(
  db: Knex,
  method: { code: string; standard_ref: string; title: string },
  properties: Array<{ property_code: string; dominance: string }>,
  createdBy: number | null,
): Promise<number> {
  const [row] = await db('test_methods').insert({ ...method, created_by: createdBy }).returning('id');
  await db('test_method_properties').insert(properties.map((p) => ({ ...p, test_method_id: row.id })));
  return row.id;
}

export function selectConditions(db: Knex): Promise<ConditionRow[]> {
  return db('conditions').orderBy(['sort_order', 'code']).select('id', 'code', 'label', 'temperature_c', 'moisture_state');
}

export async function insertCondition(db: Knex, row: Omit<ConditionRow, 'id'>): Promise<ConditionRow> {
  const max = await db('conditions').max('sort_order as m').first();
  const [inserted] = await db('conditions').insert({ ...row, sort_order: Number(max?.m ?? 0) + 1 }).returning(['id', 'code', 'label', 'temperature_c', 'moisture_state']);
  return inserted;
}
