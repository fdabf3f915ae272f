import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { fileSourceFromBuffer } from '../../api/src/coupons/coupon-file-source.ts';
import { importCouponFile } from '../../api/src/coupons/import.service.ts';
import { createMaterial, materialsByCode } from '../../api/src/materials/materials.service.ts';
import type { SessionUser } from '../../api/src/http/request-user.ts';
import { loadConfig } from '../../api/src/config.ts';
import { demoCouponCsv } from './demo/demo-coupons.ts';
import { DEMO_MATERIALS } from './demo/demo-scenario.ts';

export const DEMO_FILE_NAME = 'fjordvik-demo-coupons-INVENTED.csv';

/**
 * The invented demo scenario (PRODUCT.md): three material systems and their
 * generated coupon results (several properties, CTD/RTD/ETD/ETW, three to five
 * batches), uploaded as the demo materials engineer through the same import as
 * real files. Everything is marked invented: the material and upload rows
 * (invented = true), the names, the laboratory and the file name.
 * Idempotent and quick: materials are created once; the file is imported once
 * (recognised by its SHA-256); a database holding an earlier version of the
 * demo coupons keeps them.
 */
export async function seed(knex: Knex): Promise<void> {
  const engineer = await knex('users').where({ issuer: loadConfig().oidc.issuer, subject: 'materials' }).first('id', 'name', 'email');
  if (!engineer) return; // no demo people in this installation
  const who: SessionUser = { id: Number(engineer.id), name: engineer.name, email: engineer.email, roles: ['materials-engineer'] };

  const existing = await materialsByCode(knex, DEMO_MATERIALS.map((m) => m.code));
  for (const m of DEMO_MATERIALS) {
    if (existing.has(m.code)) continue;
    const { batches: _batches, ...fields } = m;
    await createMaterial(knex, who, { ...fields, notes: 'Invented for the Plyledger demo; not a real product.', invented: true });
  }

  const csv = demoCouponCsv();
  const sha256 = createHash('sha256').update(csv).digest('hex');
  if (await knex('uploads').where({ sha256 }).first('id')) return;
  if (await knex('uploads').where({ file_name: DEMO_FILE_NAME, invented: true }).first('id')) return;
  await importCouponFile(knex, who, { fileName: DEMO_FILE_NAME, source: fileSourceFromBuffer(Buffer.from(csv, 'utf8')) }, { invented: true });
}
