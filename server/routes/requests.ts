import { Router, type RequestHandler } from 'express';
import multer, { MulterError } from 'multer';
import { z } from 'zod';
import { createRequestInput, listRequestsQuery, updateRequestInput } from '../../shared/schemas/change-requests';
import { roles } from '../../shared/schemas/users';
import { actorOf, requireRole } from '../lib/auth';
import { AppError } from '../lib/errors';
import { MAX_UPLOAD_BYTES } from '../lib/images';
import { deps, parseQuery } from '../lib/validate';
import { checkMayUpload, deleteAttachment, readAttachment, uploadAttachment } from '../services/request-attachments';
import * as requests from '../services/requests';
import { buildCutSheet, papers } from '../services/cut-sheet';
import { idOf } from '../lib/params';


const anyRole = requireRole(...roles);
const MB = MAX_UPLOAD_BYTES / 1024 / 1024;

// One file per call, held in memory (at most 12 MB) until it is checked and stored.
const single = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 8, fieldSize: 1024, parts: 10 },
}).single('file');

/** Multer's refusals in the API's words. */
const receiveFile: RequestHandler = (req, res, next) => {
  single(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(new AppError('payload_too_large', `The file is larger than ${MB} MB. Pick a smaller photo or lower the camera resolution.`, 413, { file: [`At most ${MB} MB`] }));
      }
      if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE') {
        return next(new AppError('validation_failed', 'Send one photo per upload, in the field "file".', 400, { file: ['One photo per upload'] }));
      }
      return next(new AppError('validation_failed', `The upload could not be read (${err.message}).`, 400));
    }
    // A body that is not a well-formed multipart form (cut off, bad boundary, broken part headers).
    next(
      new AppError('validation_failed', 'The upload could not be read: send the photo again as a form with one file in the field "file".', 400, {
        file: ['The upload could not be read'],
      }),
    );
  });
};

/**
 * Change requests. Reads: every role, each seeing only the requests it may (others are 404).
 * Create: designers. Edit: the designer of a draft, a tooling engineer during review.
 * Files: see server/services/request-access.ts.
 */
export function requestsRouter() {
  const r = Router();

  r.get('/', anyRole, async (req, res) => {
    res.json(await requests.listRequests(deps(res).sequelize, actorOf(res), parseQuery(listRequestsQuery, req.query)));
  });
  r.post('/', requireRole('designer'), async (req, res) => {
    res.status(201).json(await requests.createRequest(deps(res).sequelize, actorOf(res), createRequestInput.parse(req.body)));
  });
  r.get('/impact-context', anyRole, async (req, res) => {
    const { toolId } = parseQuery(z.object({ toolId: z.uuid({ message: 'Pick a tool' }) }), req.query);
    res.json(await requests.getImpactContext(actorOf(res), toolId));
  });
  r.get('/:id', anyRole, async (req, res) => {
    res.json(await requests.getRequestDetail(actorOf(res), idOf(req.params.id, 'Change request')));
  });
  // The cut sheet (PDF), for whoever may see the request; `paper` is a4 (default) or letter.
  r.get('/:id/cut-sheet.pdf', anyRole, async (req, res) => {
    const id = idOf(req.params.id, 'Change request');
    const { paper } = parseQuery(z.object({ paper: z.enum(papers, { message: 'Pick the paper: a4 or letter' }).default('a4') }), req.query);
    const sheet = await buildCutSheet(actorOf(res), id, paper);
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('Content-Disposition', `attachment; filename="${sheet.filename}"`);
    res.type('application/pdf').send(sheet.data);
  });
  r.patch('/:id', requireRole('designer', 'engineer'), async (req, res) => {
    const id = idOf(req.params.id, 'Change request');
    res.json(await requests.updateRequest(deps(res).sequelize, actorOf(res), id, updateRequestInput.parse(req.body)));
  });

  // Files: the record is checked before the body is read, and again when the file is stored.
  const uploaders = requireRole('designer', 'engineer', 'toolmaker');
  r.post(
    '/:id/attachments',
    uploaders,
    async (req, res, next) => {
      await checkMayUpload(actorOf(res), idOf(req.params.id, 'Change request'));
      next();
    },
    receiveFile,
    async (req, res) => {
      const id = idOf(req.params.id, 'Change request');
      res.status(201).json(await uploadAttachment(deps(res).sequelize, actorOf(res), id, req.body, req.file));
    },
  );
  r.delete('/:id/attachments/:attachmentId', uploaders, async (req, res) => {
    const id = idOf(req.params.id, 'Change request');
    await deleteAttachment(deps(res).sequelize, actorOf(res), id, idOf(req.params.attachmentId, 'Attachment'));
    res.status(204).end();
  });
  return r;
}

/** The bytes of an attachment and its thumbnail, only for users who may see the request. */
export function attachmentsRouter() {
  const r = Router();
  const send = (which: 'original' | 'thumbnail'): RequestHandler =>
    async (req, res) => {
      const file = await readAttachment(actorOf(res), idOf(req.params.id, 'Attachment'), which);
      const etag = `"${file.sha256}${which === 'thumbnail' ? '-t' : ''}"`;
      res.setHeader('Cache-Control', 'private, max-age=3600');
      res.setHeader('X-Content-Type-Options', 'nosniff');
      res.setHeader('ETag', etag);
      res.setHeader('Content-Disposition', `inline; filename="${file.filename.replace(/[^\x20-\x7e]/g, '_')}"`);
      if (req.get('if-none-match') === etag) return void res.status(304).end();
      res.type(file.contentType).send(file.data);
    };
  r.get('/:id', anyRole, send('original'));
  r.get('/:id/thumbnail', anyRole, send('thumbnail'));
  return r;
}
