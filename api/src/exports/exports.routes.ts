/**
 * HTTP face of section exports and of the impact of an allowable. Analysts
 * and designers record exports; everyone signed in previews, lists,
 * downloads and reads the impact. A recorded export is sent as the file
 * itself (Content-Disposition) or, with `?reply=json`, as its record with the text.
 */
import { Router, type Response } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import { FieldReader, readId } from '../shared/read-fields.ts';
import { readExportRequest } from './export-request.ts';
import { allowableImpact, createExport, exportFile, getExport, listExports, previewExport } from './exports.service.ts';

export const EXPORTERS = ['analyst', 'designer'] as const;

function sendFile(res: Response, status: number, file: { id: number; text: string; fileName: string; contentType: string; sha256: string }) {
  res.status(status);
  res.attachment(file.fileName);
  res.set({ 'Content-Type': file.contentType, 'X-Export-Id': String(file.id), 'X-Export-Sha256': file.sha256, Location: `/api/v1/exports/${file.id}` });
  res.send(file.text);
}

export function exportsRouter(db: Knex): Router {
  const router = Router();

  router.post('/exports/preview', async (req, res) => {
    res.json(await previewExport(db, readExportRequest(req.body, { withChecks: true })));
  });

  router.post('/exports', requireRole(...EXPORTERS), async (req, res) => {
    const f = new FieldReader(req.query);
    const reply = f.oneOf('reply', ['file', 'json'] as const);
    f.done();
    const row = await createExport(db, req, readExportRequest(req.body, { withChecks: false }));
    if (reply === 'json') {
      res.status(201).location(`/api/v1/exports/${row.id}`).json({ ...(await getExport(db, row.id)), text: row.text });
      return;
    }
    sendFile(res, 201, { id: row.id, text: row.text, fileName: row.file_name, contentType: row.content_type, sha256: row.sha256 });
  });

  router.get('/exports', async (req, res) => {
    const f = new FieldReader(req.query);
    const filter = { layupId: f.integer('layupId', false, { min: 1 }), layupRevisionId: f.integer('layupRevisionId', false, { min: 1 }), allowableId: f.integer('allowableId', false, { min: 1 }) };
    f.done();
    res.json(await listExports(db, filter));
  });

  router.get('/exports/:id', async (req, res) => {
    res.json(await getExport(db, readId(req.params.id)));
  });

  router.get('/exports/:id/file', async (req, res) => {
    sendFile(res, 200, await exportFile(db, readId(req.params.id)));
  });

  router.get('/allowables/:id/impact', async (req, res) => {
    res.json(await allowableImpact(db, readId(req.params.id)));
  });

  return router;
}
