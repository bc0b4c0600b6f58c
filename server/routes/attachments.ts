import { Router } from 'express';
import {
  attachBodySchema,
  attachmentParamsSchema,
  evidenceMaxBytes,
  evidenceMediaTypes,
  rowAttachmentParamsSchema,
} from '@/shared/schemas/attachments';
import { parameterParamsSchema } from '@/shared/schemas/revisions';
import type { AppDeps } from '../app';
import { currentUser } from '../middleware/require-user';
import { acceptUpload, uploadOf } from '../middleware/upload';
import { validate, type ValidatedHandler } from '../middleware/validate';
import { attachToRow, authorizeAttach, downloadAttachment, listRowAttachments, removeFromRow } from '../services/attachments';

const rowAttachments = '/:craftId/revisions/:revisionId/parameters/:key/attachments';

/**
 * Evidence on a sheet's rows under /api/crafts/:craftId (mounted behind requireUser). A craft, revision, row
 * or file the caller may not see is 404; a refused action is 403 with the permission table's reason.
 */
export function attachmentsRouter({ sequelize }: AppDeps): Router {
  const router = Router();
  const attach: ValidatedHandler<{ params: typeof parameterParamsSchema; body: typeof attachBodySchema }> = async (req, res) => {
    const { craftId, revisionId, key } = req.params;
    const attachment = await attachToRow(sequelize, currentUser(req), craftId, revisionId, key, req.body.kind, uploadOf(req));
    res.status(201).json(attachment);
  };

  // GET /api/crafts/:craftId/revisions/:revisionId/parameters/:key/attachments: whoever may view the row;
  // RowAttachments (newest first, each with `removable`; `attachRefusal` when the caller may not attach); 404.
  router.get(rowAttachments, validate({ params: parameterParamsSchema }), async (req, res) => {
    const { craftId, revisionId, key } = req.params;
    res.json(await listRowAttachments(sequelize, currentUser(req), craftId, revisionId, key));
  });

  // POST /api/crafts/:craftId/revisions/:revisionId/parameters/:key/attachments (multipart: `file`, `kind`):
  // who may edit the row, and partners on rows shared with them, in an open revision; 201 Attachment;
  // 400 (file_missing, file_empty, unexpected_file, unexpected_field, malformed_upload, invalid_input),
  // 403 (a locked revision, the role), 404, 413 file_too_large, 415 unsupported_file_type or file_type_mismatch.
  router.post(
    rowAttachments,
    validate({ params: parameterParamsSchema }),
    // Refused before the file is read: nobody uploads 10 MB to learn they may not.
    async (req, _res, next) => {
      await authorizeAttach(sequelize, currentUser(req), req.params.craftId, req.params.revisionId, req.params.key);
      next();
    },
    acceptUpload({ maxBytes: evidenceMaxBytes, accept: evidenceMediaTypes, fields: ['kind'] }),
    validate({ body: attachBodySchema }),
    attach,
  );

  // DELETE /api/crafts/:craftId/revisions/:revisionId/parameters/:key/attachments/:attachmentId: whoever attached
  // the file, the row's subsystem owner, systems and chief engineers, in an open revision; 204; 403, 404,
  // 409 evidence_required (the last weighing report of a measured row).
  router.delete(`${rowAttachments}/:attachmentId`, validate({ params: rowAttachmentParamsSchema }), async (req, res) => {
    const { craftId, revisionId, key, attachmentId } = req.params;
    await removeFromRow(sequelize, currentUser(req), craftId, revisionId, key, attachmentId);
    res.status(204).end();
  });

  // GET /api/crafts/:craftId/attachments/:attachmentId: whoever may view a row the file is attached to; the
  // bytes as a download, typed as sniffed at upload; 404.
  router.get('/:craftId/attachments/:attachmentId', validate({ params: attachmentParamsSchema }), async (req, res) => {
    const file = await downloadAttachment(sequelize, currentUser(req), req.params.craftId, req.params.attachmentId);
    // Content-Disposition with an ASCII fallback and the UTF-8 name (RFC 6266, RFC 5987).
    res.attachment(file.name);
    res.setHeader('Content-Type', file.mediaType === 'text/plain' ? 'text/plain; charset=utf-8' : file.mediaType);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'private, no-store');
    // Opened in a tab anyway, the file runs nothing and reaches nothing.
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    res.send(file.bytes);
  });

  return router;
}
