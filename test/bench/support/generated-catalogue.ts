/**
 * A large invented catalogue for the scale bench, generated inside PostgreSQL
 * (generate_series and INSERT ... SELECT, so a million rows never cross the
 * wire): 21 material systems, 10 batches of 5 panels each, 200 uploads of
 * 5,000 coupons, and 1,000,000 coupons. CHECK constraints, unique and
 * primary keys and every index apply as to any insert. The row-by-row
 * foreign-key triggers are the one thing skipped while inserting (three
 * quarters of the insert time here): as the local cluster's superuser the
 * transaction sets session_replication_role = replica, and every foreign key
 * of specimens is then checked over the whole table by one anti-join each
 * (the check ALTER TABLE ... VALIDATE CONSTRAINT makes), which fails the bench
 * on any orphan. The rows are built by joins to the rows they reference.
 *
 * Layout of coupon i (0-based):
 *  - i < 5,000: the focus data group, material GEN-M00, tension-0 (ASTM
 *    D3039), RTD, 10 batches, all valid: the 5,000-coupon analysis;
 *  - the rest: material GEN-M01..M20 = i mod 20, one of 5 (test method,
 *    property) pairs and 4 conditions, i.e. 20 data groups of about 2,490
 *    coupons per material; 2 % excluded with a reason.
 * Strengths are normal around a mean per property (CV 4 %) with a small
 * batch effect; random() is seeded, so every run generates the same values.
 */
import type { Knex } from 'knex';

export const GENERATED_COUPONS = 1_000_000;
export const FOCUS_GROUP = { material: 'GEN-M00', property: 'tension-0', condition: 'RTD', coupons: 5000, batches: 10 } as const;
const UPLOADS = 200;
const MATERIALS = 20;

/** (test method, property, mean strength MPa, mean modulus MPa) of the generated coupons; the first is the focus group's. */
const TESTS_SQL = `(values
  (0, 'ASTM D3039', 'tension-0', 2000.0, 135000.0),
  (1, 'ASTM D3039', 'tension-90', 60.0, 9500.0),
  (2, 'ASTM D6641', 'compression-0', 1300.0, 125000.0),
  (3, 'ASTM D3518', 'in-plane-shear', 90.0, 5200.0),
  (4, 'ASTM D2344', 'short-beam-shear', 85.0, 5200.0)) as tp(idx, method, property, strength, modulus)`;

const code = (prefix: string, expr: string, width: number) => `format('${prefix}%s', lpad((${expr})::text, ${width}, '0'))`;

async function generateCatalogue(trx: Knex, userId: number) {
  await trx.raw(`insert into material_systems (code, name, form, fibre, resin, nominal_cured_ply_thickness_mm, invented)
    select ${code('GEN-M', 'm', 2)}, format('Generated carbon/epoxy tape %s (invented)', m), 'unidirectional-tape', 'carbon', 'epoxy', 0.125, true
    from generate_series(0, ${MATERIALS}) m`);
  await trx.raw(`insert into batches (material_id, code)
    select ms.id, ${code('B', 'b', 2)} from material_systems ms cross join generate_series(1, ${FOCUS_GROUP.batches}) b where ms.code like 'GEN-M%'`);
  await trx.raw(`insert into panels (batch_id, code)
    select ba.id, format('P%s', p) from batches ba join material_systems ms on ms.id = ba.material_id cross join generate_series(1, 5) p where ms.code like 'GEN-M%'`);
  // each upload's stored file is one piece (upload_chunks), written with it
  await trx.raw(`with made as (
      insert into uploads (file_name, sha256, size_bytes, row_count, invented, uploaded_by, uploaded_by_name)
      select format('generated-%s.csv', u), md5('generated ' || u) || md5('upload ' || u), octet_length(convert_to('generated upload ' || u, 'UTF8')),
        ${GENERATED_COUPONS / UPLOADS}, true, ?, 'bench generator'
      from generate_series(1, ${UPLOADS}) u
      returning id, file_name)
    insert into upload_chunks (upload_id, seq, bytes)
    select id, 0, convert_to('generated upload ' || substring(file_name from 'generated-([0-9]+)[.]csv'), 'UTF8') from made`, [userId]);
}

async function generateCoupons(trx: Knex, userId: number): Promise<boolean> {
  const [{ rolsuper }] = (await trx.raw('select rolsuper from pg_roles where rolname = current_user')).rows;
  if (rolsuper) await trx.raw('set local session_replication_role = replica');
  // The lookups below join a million generated rows to a thousand catalogue rows
  // written moments ago: fresh statistics, each lookup materialised whole and
  // hash joins only (a nested loop, or panels joined on their number before
  // their batch, chosen on a bad estimate turns a minute into an hour).
  await trx.raw('analyze material_systems, batches, panels, uploads');
  await trx.raw('set local enable_nestloop = off');
  await trx.raw('set local jit = off');
  await trx.raw('select setseed(0.4217)');
  const focus = FOCUS_GROUP.coupons;
  const perMaterial = (GENERATED_COUPONS - focus) / MATERIALS;
  const perUpload = GENERATED_COUPONS / UPLOADS;
  // Rows come out in specimen-code order (material, then i) without a sort, so the
  // unique code index and the data-group index are filled mostly at their ends.
  await trx.raw(`insert into specimens (specimen_code, material_id, batch_id, panel_id, test_method_id, property_code, condition_id, width_mm, thickness_mm,
      ply_count, failure_load_n, strength_mpa, modulus_mpa, poisson_ratio, failure_strain, failure_mode, test_date, laboratory,
      status, status_reason, status_changed_by, status_changed_by_name, status_changed_at, upload_id, upload_row)
    with ids as (
      select i from generate_series(0, ${focus - 1}) i
      union all
      select ${focus} + (j % ${perMaterial}) * ${MATERIALS} + j / ${perMaterial} from generate_series(0, ${GENERATED_COUPONS - focus - 1}) j
    ), g as (
      select i,
        case when i < ${focus} then 0 else 1 + i % ${MATERIALS} end as m,
        case when i < ${focus} then 0 else (i / ${MATERIALS}) % 5 end as t,
        case when i < ${focus} then 1 else (i / ${MATERIALS * 5}) % 4 end as c,
        1 + (i / 7) % ${FOCUS_GROUP.batches} as b,
        1 + (i / 70) % 5 as p,
        1 + i / ${perUpload} as u,
        i >= ${focus} and i % 50 = 7 as excluded,
        sqrt(-2 * ln(1 - random())) * cos(2 * pi() * random()) as z,
        random() - 0.5 as w
      from ids
    ), places as materialized (
      select (regexp_match(ms.code, '^GEN-M(\\d+)$'))[1]::int as m, (regexp_match(ba.code, '^B(\\d+)$'))[1]::int as b, (regexp_match(pa.code, '^P(\\d+)$'))[1]::int as p,
        ms.id as material_id, ba.id as batch_id, pa.id as panel_id
      from material_systems ms join batches ba on ba.material_id = ms.id join panels pa on pa.batch_id = ba.id
      where ms.code like 'GEN-M%'
    ), tests as materialized (
      select tp.*, tm.id as test_method_id from ${TESTS_SQL} join test_methods tm on tm.code = tp.method
    ), conds as materialized (
      select k - 1 as c, co.id from unnest(array['CTD', 'RTD', 'ETD', 'ETW']) with ordinality x(code, k) join conditions co on co.code = x.code
    ), ups as materialized (
      select (regexp_match(file_name, '^generated-(\\d+)[.]csv$'))[1]::int as u, id from uploads where file_name like 'generated-%'
    ), v as (
      select g.*, tests.property, tests.test_method_id, tests.modulus * (1 + 0.04 * g.w) as modulus,
        tests.strength * (1 + 0.04 * g.z + 0.01 * (g.b - 5.5) / 4.5) as strength,
        case when g.i % 2 = 1 then 25.0 else 12.7 end as width, 1 + (g.i % 40) / 1000.0 as thickness
      from g join tests on tests.idx = g.t
    )
    select ${code('GEN-M', 'v.m', 2)} || '-' || lpad(v.i::text, 7, '0'), places.material_id, places.batch_id, places.panel_id, v.test_method_id, v.property, conds.id,
      v.width, v.thickness, 8, v.strength * v.width * v.thickness, v.strength, v.modulus, case when v.property = 'tension-0' then 0.31 end, v.strength / v.modulus, 'LGM',
      date '2023-01-02' + (v.i % 900), 'Generated laboratory (invented)',
      case when v.excluded then 'excluded' else 'valid' end, case when v.excluded then 'generated: failure outside the gauge section' end,
      case when v.excluded then ?::bigint end, case when v.excluded then 'bench generator' end, case when v.excluded then now() end,
      ups.id, v.i % ${perUpload} + 2
    from v
    join places on places.m = v.m and places.b = v.b and places.p = v.p
    join conds on conds.c = v.c
    join ups on ups.u = v.u`, [userId]);
  return rolsuper;
}

/** Each foreign key of specimens, read from the catalogue: its columns and the referenced table's. */
async function specimenForeignKeys(db: Knex): Promise<Array<{ name: string; refTable: string; cols: string[]; refCols: string[] }>> {
  const result = await db.raw(`select c.conname as name, c.confrelid::regclass::text as "refTable",
      array(select a.attname::text from unnest(c.conkey) with ordinality k(n, o) join pg_attribute a on a.attrelid = c.conrelid and a.attnum = k.n order by k.o) as cols,
      array(select a.attname::text from unnest(c.confkey) with ordinality k(n, o) join pg_attribute a on a.attrelid = c.confrelid and a.attnum = k.n order by k.o) as "refCols"
    from pg_constraint c where c.conrelid = 'specimens'::regclass and c.contype = 'f' order by c.conname`);
  return result.rows;
}

/** Throws unless every row of specimens meets every foreign key (MATCH SIMPLE: a row with a null key column is not checked). */
async function verifyForeignKeys(db: Knex): Promise<number> {
  const keys = await specimenForeignKeys(db);
  for (const key of keys) {
    const notNull = key.cols.map((c) => `s.${c} is not null`).join(' and ');
    const matches = key.cols.map((c, i) => `r.${key.refCols[i]} = s.${c}`).join(' and ');
    const [{ orphans }] = (await db.raw(`select count(*)::int as orphans from specimens s where ${notNull} and not exists (select 1 from ${key.refTable} r where ${matches})`)).rows;
    if (orphans) throw new Error(`generated catalogue: ${orphans} coupons break foreign key ${key.name}`);
  }
  return keys.length;
}

export interface GeneratedCatalogue {
  generateMs: number;
  /** Foreign keys checked over the whole table after the insert (0 when the triggers checked them row by row). */
  foreignKeysVerified: number;
  verifyMs: number;
  analyseMs: number;
  coupons: number;
}

/** Generates the catalogue in one transaction, checks the foreign keys, then VACUUM ANALYZE (visibility map for index-only scans, fresh statistics). */
export async function generateLargeCatalogue(db: Knex, userId: number): Promise<GeneratedCatalogue> {
  const started = performance.now();
  const triggersSkipped = await db.transaction(async (trx) => {
    await generateCatalogue(trx, userId);
    return generateCoupons(trx, userId);
  });
  const generated = performance.now();
  const foreignKeysVerified = triggersSkipped ? await verifyForeignKeys(db) : 0;
  const verified = performance.now();
  await db.raw('vacuum (analyze) specimens');
  await db.raw('analyze material_systems, batches, panels, uploads');
  const analysed = performance.now();
  const [{ n }] = (await db.raw('select count(*)::int as n from specimens')).rows;
  return { generateMs: generated - started, foreignKeysVerified, verifyMs: verified - generated, analyseMs: analysed - verified, coupons: n };
}
