/**
 * HTTP face of coupons: the upload template, the upload itself (materials
 * engineers), the upload records and stored files, the paged coupon table, and
 * excluding or restoring a coupon with a reason (materials engineers).
 */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import { badRequest } from '../http/errors.ts';
import { conditionIndex } from '../materials/reference.service.ts';
import { InputError } from '../shared/input-error.ts';
import { FieldReader, readId } from '../shared/read-fields.ts';
import { templateCsv } from './csv-template.ts';
import { FORCE_UNITS, LENGTH_UNITS, SI_UNITS, STRESS_UNITS, US_UNITS, type UploadUnits } from './csv-units.ts';
import { importCouponFile } from './import.service.ts';
import { SORTABLE, type SortKey } from './specimens.queries.ts';
import { changeSpecimenStatus, dataGroupCounts, getSpecimen, getUpload, listSpecimens, listUploads, uploadFile } from './specimens.service.ts';
import { discardReceivedFile, fileNameOf, receiveCouponFile, receivedFileSource } from './upload-middleware.ts';

export const COUPON_EDITORS = ['materials-engineer'] as const;

function readMapping(raw: unknown): Record<string, string> {
  if (raw === undefined || raw === '') return {};
  let parsed: unknown;
  try {
    parsed = typeof raw === 'string' ? JSON.parse(raw) : raw;
  } catch {
    throw new InputError({ field: 'columns', message: 'is not valid JSON', fix: 'send {"specimen_id": "Specimen", ...}: template field -> column header' });
  }
  if (!parsed || typeof parsed !== 'object' || Array.isArray(parsed) || Object.values(parsed).some((v) => typeof v !== 'string')) {
    throw new InputError({ field: 'columns', message: 'must be an object of template field -> column header', fix: 'send {"specimen_id": "Specimen", "strength": "Fmax/A"}' });
  }
  return parsed as Record<string, string>;
}

function readUnits(body: unknown): Partial<UploadUnits> {
  const f = new FieldReader(body);
  const units = { stress: f.oneOf('stressUnit', STRESS_UNITS), length: f.oneOf('lengthUnit', LENGTH_UNITS), force: f.oneOf('forceUnit', FORCE_UNITS) };
  f.done();
  return Object.fromEntries(Object.entries(units).filter(([, v]) => v !== undefined));
}

export function couponsRouter(db: Knex): Router {
  const router = Router();

  router.get('/uploads/template.csv', (req, res) => {
    const f = new FieldReader(req.query);
    const system = f.oneOf('units', ['SI', 'US'] as const) ?? 'SI';
    f.done();
    res
      .type('text/csv; charset=utf-8')
      .attachment(`plyledger-coupon-template-${system}.csv`)
      .send(templateCsv(system === 'US' ? US_UNITS : SI_UNITS));
  });

  router.post('/uploads', requireRole(...COUPON_EDITORS), receiveCouponFile, async (req, res) => {
    try {
      if (!req.file) throw badRequest('The form has no file; send the CSV in the field "file"', { problems: [{ field: 'file', message: 'missing', fix: 'choose a CSV file' }] });
      const mapping = readMapping(req.body?.columns);
      const units = readUnits(req.body);
      const result = await importCouponFile(db, req, { fileName: fileNameOf(req.file.originalname), source: receivedFileSource(req.file), contentType: req.file.mimetype }, { mapping, units });
      res.status(201).json(result);
    } finally {
      await discardReceivedFile(req);
    }
  });

  router.get('/uploads', async (req, res) => {
    const f = new FieldReader(req.query);
    const limit = f.integer('limit', false, { min: 1, max: 200 }) ?? 50;
    const beforeId = f.integer('beforeId', false, { min: 1 });
    f.done();
    res.json(await listUploads(db, limit, beforeId));
  });
  router.get('/uploads/:id', async (req, res) => {
    res.json(await getUpload(db, readId(req.params.id)));
  });
  router.get('/uploads/:id/file', async (req, res) => {
    const file = await uploadFile(db, readId(req.params.id));
    res.type(file.contentType || 'text/csv').attachment(file.fileName).set('Content-Length', String(file.sizeBytes));
    try {
      // one stored piece at a time; pipeline destroys the response if a piece cannot be read, so a cut file never looks whole
      await pipeline(Readable.from(file.chunks()), res);
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'ERR_STREAM_PREMATURE_CLOSE') throw err; // the client went away
    }
  });

  router.get('/specimens', async (req, res) => {
    const f = new FieldReader(req.query);
    const conditionCode = f.text('condition');
    const query = {
      materialId: f.integer('material', false, { min: 1 }),
      batchId: f.integer('batch', false, { min: 1 }),
      uploadId: f.integer('upload', false, { min: 1 }),
      propertyCode: f.text('property'),
      status: f.oneOf('status', ['valid', 'excluded'] as const),
      codePrefix: f.text('q', false, { maxLength: 80 }),
      sort: f.oneOf('sort', Object.keys(SORTABLE) as SortKey[]) ?? 'specimenCode',
      descending: f.oneOf('order', ['asc', 'desc'] as const) === 'desc',
      page: f.integer('page', false, { min: 1 }) ?? 1,
      pageSize: f.integer('pageSize', false, { min: 1, max: 200 }) ?? 50,
    };
    f.done();
    let conditionId: number | undefined;
    if (conditionCode) {
      const condition = (await conditionIndex(db)).byCode.get(conditionCode.toUpperCase());
      // an unknown condition matches no coupon rather than failing the table
      conditionId = condition?.id ?? -1;
    }
    res.json(await listSpecimens(db, { ...query, conditionId }));
  });
  router.get('/data-groups', async (req, res) => {
    const f = new FieldReader(req.query);
    const materialId = f.integer('material', true, { min: 1 });
    f.done();
    const [groups, conditions] = await Promise.all([dataGroupCounts(db, materialId), conditionIndex(db)]);
    res.json({ items: groups.map(({ conditionId, ...g }) => ({ ...g, condition: { id: conditionId, code: conditions.byId.get(conditionId)?.code ?? null } })) });
  });
  router.get('/specimens/:id', async (req, res) => {
    res.json(await getSpecimen(db, readId(req.params.id)));
  });
  for (const [verb, status] of [['exclude', 'excluded'], ['restore', 'valid']] as const) {
    router.post(`/specimens/:id/${verb}`, requireRole(...COUPON_EDITORS), async (req, res) => {
      const id = readId(req.params.id);
      const f = new FieldReader(req.body);
      const reason = f.text('reason', true, { maxLength: 2000 });
      f.done();
      res.json(await changeSpecimenStatus(db, req, id, status, reason));
    });
  }

  return router;
}
