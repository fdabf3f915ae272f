import type { Knex } from 'knex';

/**
 * Found by `npm run bench -- scale` (1,000,000 coupons):
 * - the coupon list of one material sorted by test date (newest first is how
 *   a materials engineer looks for the latest results): with the material
 *   first and the date after it, a page is read off the index in order, either
 *   way, instead of collecting and sorting all 50,000 coupons of the material;
 * - the count of a filter on the test property or the condition alone (about
 *   200,000 matches each) read the whole data-group index; an index of that
 *   column alone holds only the matching entries together.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw('create index specimens_material_date_idx on specimens (material_id, test_date, id)');
  await knex.raw('create index specimens_property_idx on specimens (property_code)');
  await knex.raw('create index specimens_condition_idx on specimens (condition_id)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index if exists specimens_condition_idx');
  await knex.raw('drop index if exists specimens_property_idx');
  await knex.raw('drop index if exists specimens_material_date_idx');
}
