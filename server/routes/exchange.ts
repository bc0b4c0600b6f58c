import { Router, type RequestHandler } from 'express';
import { acceptImportBodySchema, importParamsSchema, type ExportFormat } from '@/shared/schemas/exchange';
import { revisionParamsSchema } from '@/shared/schemas/revisions';
import { IMPORT_LIMITS } from '@/shared/exchange/layout';
import type { AppDeps } from '../app';
import { currentUser } from '../middleware/require-user';
import { acceptUpload, uploadOf } from '../middleware/upload';
import { validate } from '../middleware/validate';
import { exportRevision } from '../services/exchange/exports';
import { acceptImport, authorizeImport, createImport } from '../services/exchange/imports';
import { OLE_CONTAINER } from '../services/exchange/workbook-guard';

/**
 * Spreadsheet exchange under /api/crafts/:craftId: a revision exported as a workbook, JSON or CSV, and workbooks
 * imported against a revision (a preview first, then a study). Mounted behind requireUser; a craft the caller may
 * not see is 404, a refused action 403.
 */
export function exchangeRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  // GET /api/crafts/:craftId/revisions/:revisionId/export.xlsx | .json | .csv: whoever views the craft (partners: the
  // rows shared with them); the workbook (live formulas over one defined name per key, mass budget, cover), the sheet
  // JSON, or the computed values as CSV, as a download; 404.
  for (const format of ['xlsx', 'json', 'csv'] as const satisfies readonly ExportFormat[]) {
    router.get(`/:craftId/revisions/:revisionId/export.${format}`, validate({ params: revisionParamsSchema }), async (req, res) => {
      const file = await exportRevision(currentUser(req), req.params.craftId, req.params.revisionId, format);
      res
        .status(200)
        .type(file.type)
        .set('Content-Disposition', `attachment; filename="${file.fileName}"`)
        .set('X-Content-Type-Options', 'nosniff')
        .send(file.body);
    });
  }

  // The caller's right to import is checked before the upload is read.
  const mayImport: RequestHandler = async (req, _res, next) => {
    await authorizeImport(currentUser(req), String(req.params.craftId));
    next();
  };

  // POST /api/crafts/:craftId/revisions/:revisionId/imports (multipart `file`, an .xlsx in Trimsheet's layout, at
  // most 8 MB): partners, subsystem owners, systems and chief engineers; 201 ImportPreview (nothing of the sheet is
  // written); 400 file_missing, malformed_workbook, not_trimsheet_layout, external_links, external_reference,
  // unknown_function; 403, 404; 413 file_too_large, unpacked_too_large, too_many_entries, too_many_rows; 415
  // unsupported_file_type, file_type_mismatch, encrypted_workbook, macro_workbook, not_a_workbook.
  router.post(
    '/:craftId/revisions/:revisionId/imports',
    validate({ params: revisionParamsSchema }),
    mayImport,
    acceptUpload({
      maxBytes: IMPORT_LIMITS.maxFileBytes,
      accept: ['application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', 'application/zip', OLE_CONTAINER],
    }),
    async (req, res) => {
      res.status(201).json(await createImport(currentUser(req), req.params.craftId, req.params.revisionId, uploadOf(req)));
    },
  );

  // POST /api/crafts/:craftId/imports/:importId/accept: the importer; `name`, `note`; 201 Revision (the study it
  // opened); 400 invalid_input, 403, 404, 409 already_accepted, import_stale or import_breaks_sheet, 410 import_expired.
  router.post(
    '/:craftId/imports/:importId/accept',
    validate({ params: importParamsSchema, body: acceptImportBodySchema }),
    async (req, res) => {
      res.status(201).json(await acceptImport(sequelize, currentUser(req), req.params.craftId, req.params.importId, req.body));
    },
  );

  return router;
}
