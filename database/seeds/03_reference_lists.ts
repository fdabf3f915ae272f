import type { Knex } from 'knex';
import { REFERENCE_CONDITIONS, REFERENCE_TEST_METHODS, TEST_PROPERTIES } from '../../api/src/materials/vocabulary.ts';

/**
 * Reference lists every installation starts with: test properties, the usual
 * ASTM test methods with the properties they yield, and the usual conditions.
 * Idempotent: rows are merged by code; lists added by people are left alone.
 */
export async function seed(knex: Knex): Promise<void> {
  await knex('test_properties')
    .insert(TEST_PROPERTIES.map((p, i) => ({ code: p.code, label: p.label, sort_order: i })))
    .onConflict('code')
    .merge();
  for (const method of REFERENCE_TEST_METHODS) {
    const [row] = await knex('test_methods')
      .insert({ code: method.code, standard_ref: method.standardRef, title: method.title })
      .onConflict('code')
      .merge(['standard_ref', 'title'])
      .returning('id');
    await knex('test_method_properties')
      .insert(method.properties.map((p) => ({ test_method_id: row.id, property_code: p.property, dominance: p.dominance })))
      .onConflict(['test_method_id', 'property_code'])
      .merge(['dominance']);
  }
  await knex('conditions')
    .insert(REFERENCE_CONDITIONS.map((c, i) => ({ code: c.code, label: c.label, temperature_c: c.temperatureC, moisture_state: c.moistureState, sort_order: i })))
    .onConflict('code')
    .merge();
}
