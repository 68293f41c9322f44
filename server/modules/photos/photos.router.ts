// Photo upload and delivery. Mounted at /api, so every route spells its full path and
// carries its own guard (a router-wide guard would answer for all of /api).
import type { Request, Response } from 'express';
import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { uuidParam } from '../../../shared/schemas/common.js';
import { actorOf, requireActive } from '../../auth/guards.js';
import type { AppContext } from '../../context.js';
import { assertStorableText, badRequest, fromZod, HttpError, notFound } from '../../lib/http-error.js';
import { route } from '../../lib/route.js';
import {
  addPhoto,
  addReportPhoto,
  assertMayAddPhoto,
  assertMayAddReportPhoto,
  MAX_UPLOAD_BYTES,
  photoFile,
  photosDir,
  readPhotoPosition,
  removePhoto,
} from './photos.service.js';

const idParams = z.object({ id: uuidParam });

const captionField = z
  .string({ error: 'Caption must be text' })
  .trim()
  .max(500, 'Caption is at most 500 characters')
  .optional()
  .transform((v) => v || null);

/** The text parts of an upload form; browsers send empty strings for untouched inputs. */
export const photoFieldsSchema = z.object({
  caption: captionField,
  findingId: z
    .union([z.literal(''), uuidParam])
    .optional()
    .transform((v) => v || null),
});

/** The text part of a strike-report photo upload. */
export const reportPhotoFieldsSchema = z.object({ caption: captionField });

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 4, fieldSize: 4_000, parts: 6 },
}).single('photo');

function fromMulter(err: unknown): HttpError {
  if (err instanceof multer.MulterError) {
    switch (err.code) {
      case 'LIMIT_FILE_SIZE':
        return new HttpError(413, 'file_too_large', 'The photo is larger than 10 MB.', { photo: 'larger than 10 MB' });
      case 'LIMIT_FILE_COUNT':
      case 'LIMIT_UNEXPECTED_FILE':
        return badRequest('Send one photo, in the field "photo".', { photo: 'send one file in this field' });
      case 'LIMIT_FIELD_VALUE':
        return badRequest('A form field is too long.', { [err.field ?? '_']: 'too long' });
      default:
        // Too many parts or fields, a part without a name: the form as a whole ('_') unless multer names the field.
        return badRequest(`The upload form was refused: ${err.message}.`, { [err.field || '_']: err.message });
    }
  }
  // busboy's own complaints (cut-off body, broken part headers) are the client's.
  return new HttpError(400, 'malformed_upload', 'The upload could not be read; send it again as multipart/form-data.');
}

/** Runs multer for this request only, after the caller's rights are known to be good. */
async function receivePhoto(req: Request, res: Response): Promise<Buffer> {
  await new Promise<void>((resolve, reject) => upload(req, res, (err: unknown) => (err ? reject(fromMulter(err)) : resolve())));
  if (!req.file) throw badRequest('Choose a photo to upload.', { photo: 'no file was sent' });
  return req.file.buffer;
}

export function photosRouter(ctx: AppContext): Router {
  const r = Router();
  const active = requireActive(ctx);
  const deps = { db: ctx.db, dir: photosDir(ctx.config) };

  r.post(
    '/mother-plants/:id/photos',
    active,
    route(
      { params: idParams },
      async ({ params }, req, res) => {
        // Refuse before reading up to 10 MB from someone who may not add photos here.
        await assertMayAddPhoto(ctx.db, actorOf(req), params.id);
        const buffer = await receivePhoto(req, res);
        const fields = photoFieldsSchema.safeParse(req.body ?? {});
        if (!fields.success) throw fromZod(fields.error, 'form');
        assertStorableText(fields.data, 'form');
        return addPhoto(deps, actorOf(req), params.id, buffer, fields.data);
      },
      { status: 201 },
    ),
  );

  r.post(
    '/strike-reports/:id/photos',
    active,
    route(
      { params: idParams },
      async ({ params }, req, res) => {
        // As for plants: the reporter is known to be the caller before any of the upload is read.
        await assertMayAddReportPhoto(ctx.db, actorOf(req), params.id);
        const buffer = await receivePhoto(req, res);
        const fields = reportPhotoFieldsSchema.safeParse(req.body ?? {});
        if (!fields.success) throw fromZod(fields.error, 'form');
        assertStorableText(fields.data, 'form');
        return addReportPhoto(deps, actorOf(req), params.id, buffer, fields.data);
      },
      { status: 201 },
    ),
  );

  r.post(
    '/photos/read-gps',
    active,
    route({}, async (_input, req, res) => readPhotoPosition(await receivePhoto(req, res))),
  );

  for (const kind of ['image', 'thumb'] as const) {
    r.get(
      `/photos/:id/${kind}`,
      active,
      route({ params: idParams }, async ({ params }, req, res) => {
        const file = await photoFile(ctx.db, actorOf(req), params.id, kind);
        await new Promise<void>((resolve, reject) => {
          res.sendFile(
            file.name,
            {
              // root makes send refuse anything that would climb out of the photo folder.
              root: deps.dir,
              dotfiles: 'deny',
              cacheControl: false,
              headers: {
                'Content-Type': file.mimeType,
                'Cache-Control': 'private, max-age=86400',
                'X-Content-Type-Options': 'nosniff',
              },
            },
            (err?: Error & { status?: number }) => {
              if (!err || res.headersSent) return resolve();
              reject(err.status === 404 ? notFound('That photo file') : err);
            },
          );
        });
      }),
    );
  }

  r.delete(
    '/photos/:id',
    active,
    route({ params: idParams }, async ({ params }, req) => {
      await removePhoto(deps, actorOf(req), params.id);
    }),
  );

  return r;
}
