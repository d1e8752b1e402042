import { Router } from 'express';
import { photoFieldsSchema } from '#shared/schemas/plantings';
import type { AppConfig } from '../../config';
import { parseBody } from '../../lib/validate';
import { mountRoutes, requireSignedIn } from '../../lib/routes';
import type { RouteTableEntry } from '../../lib/routes';
import { AppError } from '../../errors';
import { recordId } from '../records/params';
import { receiveOneFile } from '../../lib/upload';
import { localDate } from '../../lib/local-date';
import { getGarden } from '../gardens/gardens.service';
import { deletePhoto, getPhoto, listPhotos, photoContent, savePhoto } from './photos.service';
import { presentPhoto } from './photos.presenter';

export function photosRouter(config: AppConfig, table: RouteTableEntry[]) {
  const router = Router();
  const uploads = config.uploads;
  mountRoutes(
    router,
    '/api/gardens/:gardenId/plantings/:plantingId/photos',
    [
      {
        method: 'get',
        path: '/',
        access: 'viewer',
        handler: async (req, res) => {
          const photos = await listPhotos(req.membership!.gardenId, recordId(req.params, 'plantingId'));
          res.json({ photos: photos.map(presentPhoto) });
        },
      },
      {
        method: 'post',
        path: '/',
        access: 'grower',
        // Parsed before the handler, so an Idempotency-Key's fingerprint covers the photo and its fields.
        before: [
          (req, res, next) => {
            receiveOneFile(req, res, 'photo', { maxBytes: uploads.maxBytes, fields: 2 }).then((file) => {
              (req as { file?: unknown }).file = file ?? undefined;
              next();
            }, next);
          },
        ],
        handler: async (req, res) => {
          const user = requireSignedIn(req);
          const gardenId = req.membership!.gardenId;
          const plantingId = recordId(req.params, 'plantingId');
          const file = (req as { file?: { buffer: Buffer } }).file;
          if (!file) throw new AppError(400, 'validation_failed', 'Please check the fields: photo.', { photo: 'Attach a photo (JPEG, PNG or WebP).' });
          const fields = parseBody(photoFieldsSchema, { ...req.body });
          const takenOn = fields.takenOn ?? localDate((await getGarden(gardenId)).timeZone);
          const photo = await savePhoto(uploads, { gardenId, plantingId, userId: user.id, buffer: file.buffer, caption: fields.caption ?? '', takenOn });
          res.status(201).json({ photo: presentPhoto(photo) });
        },
      },
      {
        method: 'get',
        path: '/:photoId',
        access: 'viewer',
        handler: async (req, res) => {
          const photo = await getPhoto(req.membership!.gardenId, recordId(req.params, 'plantingId'), recordId(req.params, 'photoId'));
          // From the database, so any instance serves it (see savePhoto).
          const data = await photoContent(uploads, photo);
          if (!data) throw AppError.notFound('That photo file');
          res.set({
            'Content-Type': 'image/jpeg',
            'X-Content-Type-Options': 'nosniff',
            'Content-Disposition': 'inline; filename="photo.jpg"',
            'Content-Security-Policy': "default-src 'none'; sandbox",
            'Cache-Control': 'private, max-age=3600',
            'Content-Length': String(data.length),
          });
          res.end(data);
        },
      },
      {
        method: 'delete',
        path: '/:photoId',
        access: 'grower',
        handler: async (req, res) => {
          await deletePhoto(uploads, req.membership!.gardenId, recordId(req.params, 'plantingId'), recordId(req.params, 'photoId'));
          res.status(204).end();
        },
      },
    ],
    table,
  );
  return router;
}
