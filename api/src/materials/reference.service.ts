/**
 * The reference lists of the catalogue: test properties, test methods (with
 * the properties each yields and their dominance) and conditions. Seeded with
 * the usual ones (database/seeds/03_reference_lists.ts); materials engineers and
 * administrators may add more.
 */
import type { Knex } from 'knex';
import { audit } from '../audit/audit.service.ts';
import { conflict } from '../http/errors.ts';
import { actorOf, type Who } from '../shared/actor.ts';
import { isForeignKeyViolation, isUniqueViolation } from '../shared/database-errors.ts';
import { InputError } from '../shared/input-error.ts';
import { insertCondition, insertTestMethod, selectConditions, selectTestMethods, selectTestProperties } from './reference.queries.ts';
import { toCondition, toTestMethod, type Condition, type TestMethod } from './materials.wire.ts';
import type { Dominance, MoistureState } from './vocabulary.ts';

export function listTestProperties(db: Knex) {
  return selectTestProperties(db);
}

export async function listTestMethods(db: Knex): Promise<TestMethod[]> {
  return (await selectTestMethods(db)).map(toTestMethod);
}

export async function createTestMethod(
  db: Knex,
  who: Who,
  input: { code: string; standardRef: string; title: string; properties: Array<{ property: string; dominance: Dominance }> },
): Promise<TestMethod> {
  try {
    return await db.transaction(async (trx) => {
      const userId = actorOf(who).id;
      const id = await insertTestMethod(trx, { code: input.code, standard_ref: input.standardRef, title: input.title },
        input.properties.map((p) => ({ property_code: p.property, dominance: p.dominance })), userId);
      await audit(trx, who, { action: 'test-method.created', entityType: 'test-method', entityId: id, details: { code: input.code, properties: input.properties } });
      return (await listTestMethods(trx)).find((m) => m.id === id)!;
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw conflict(`A test method with the code '${input.code}' exists already`, { field: 'code' });
    if (isForeignKeyViolation(err)) {
      const known = (await listTestProperties(db)).map((p) => p.code);
      throw new InputError({ field: 'properties', message: 'names a property that is not in the list of test properties', fix: `use ${known.join(', ')}` });
    }
    throw err;
  }
}

export async function listConditions(db: Knex): Promise<Condition[]> {
  return (await selectConditions(db)).map(toCondition);
}

export async function createCondition(db: Knex, who: Who, input: { code: string; label: string; temperatureC: number; moistureState: MoistureState }): Promise<Condition> {
  try {
    return await db.transaction(async (trx) => {
      const row = await insertCondition(trx, { code: input.code, label: input.label, temperature_c: input.temperatureC, moisture_state: input.moistureState });
      await audit(trx, who, { action: 'condition.created', entityType: 'condition', entityId: row.id, details: { code: row.code } });
      return toCondition(row);
    });
  } catch (err) {
    if (isUniqueViolation(err)) throw conflict(`A condition with the code '${input.code}' exists already`, { field: 'code' });
    throw err;
  }
}

// ---- for other domains ----

/** Test methods by code and by id, each with its properties' dominance. */
export async function testMethodIndex(db: Knex) {
  const methods = await listTestMethods(db);
  const dominance = (m: TestMethod) => new Map(m.properties.map((p) => [p.property, p.dominance as Dominance]));
  return {
    byCode: new Map(methods.map((m) => [m.code.toLowerCase(), { ...m, dominance: dominance(m) }])),
    byId: new Map(methods.map((m) => [m.id, { ...m, dominance: dominance(m) }])),
  };
}

export async function conditionIndex(db: Knex) {
  const conditions = await listConditions(db);
  return { byCode: new Map(conditions.map((c) => [c.code.toUpperCase(), c])), byId: new Map(conditions.map((c) => [c.id, c])) };
}
