import { randomBytes } from 'node:crypto';
import { mkdir, unlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import type { Metadata } from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import type { AppConfig } from '../../config';
import { Planting, PlantingLog, PlantingPhoto, User } from '../../db/models';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import type { Transaction } from 'sequelize';

const ACCEPTED = new Set(['image/jpeg', 'image/png', 'image/webp']);
/** Longest edge kept: plenty for a bed photo on any screen, a fraction of a phone camera's file. */
const MAX_EDGE = 2048;

type Uploads = AppConfig['uploads'];

export const photoDir = (uploads: Uploads) => path.join(uploads.dir, 'photos');

export function photoPath(uploads: Uploads, storageName: string) {
  // Names are ours (random, from the database); the check guards against a corrupted row.
  if (!/^[A-Za-z0-9_-]{20,60}\.jpg$/.test(storageName)) throw new Error('Invalid stored photo name');
  return path.join(photoDir(uploads), storageName);
}

/**
 * Checks the type by content (an HTML file named .jpg is refused), the pixel count, then
 * re-encodes to JPEG: the new file carries no metadata (no EXIF, so no GPS position), and
 * the camera's orientation is applied to the pixels first.
 */
export async function cleanImage(buffer: Buffer, uploads: Uploads) {
  const type = await fileTypeFromBuffer(buffer);
  if (!type || !ACCEPTED.has(type.mime)) {
    throw new AppError(415, 'unsupported_image', 'That file is not a JPEG, PNG or WebP photo.', { photo: 'Choose a JPEG, PNG or WebP photo.' });
  }
  let meta: Metadata;
  try {
    meta = await sharp(buffer, { limitInputPixels: false }).metadata();
  } catch {
    throw new AppError(415, 'unsupported_image', 'The photo could not be read.', { photo: 'The photo could not be read.' });
  }
  const pixels = (meta.width ?? 0) * (meta.height ?? 0);
  if (!pixels || pixels > uploads.maxPixels) {
    throw new AppError(413, 'image_too_large', `The photo has too many pixels (at most ${Math.round(uploads.maxPixels / 1e6)} megapixels).`, {
      photo: 'The photo has too many pixels.',
    });
  }
  try {
    return await sharp(buffer, { limitInputPixels: uploads.maxPixels, failOn: 'error' })
      .rotate()
      .resize({ width: MAX_EDGE, height: MAX_EDGE, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 82 })
      .toBuffer({ resolveWithObject: true });
  } catch {
    throw new AppError(415, 'unsupported_image', 'The photo could not be read.', { photo: 'The photo could not be read.' });
  }
}

async function plantingOf(gardenId: number, plantingId: number, transaction?: Transaction) {
  // In a transaction the row is locked for share: a delete of the planting waits for this insert
  // (and then removes its file too), or this insert waits for the delete and answers 404.
  const planting = await Planting.findOne({ where: { id: plantingId, gardenId }, attributes: ['id'], transaction, ...(transaction ? { lock: transaction.LOCK.SHARE } : {}) });
  if (!planting) throw AppError.notFound('That planting');
  return planting;
}

export async function listPhotos(gardenId: number, plantingId: number) {
  await plantingOf(gardenId, plantingId);
  return PlantingPhoto.findAll({
    where: { gardenId, plantingId },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'], required: false }],
    order: [['takenOn', 'DESC'], ['id', 'DESC']],
  });
}

export async function getPhoto(gardenId: number, plantingId: number, photoId: number) {
  const photo = await PlantingPhoto.findOne({
    where: { id: photoId, plantingId, gardenId },
    include: [{ model: User, as: 'author', attributes: ['id', 'name'], required: false }],
  });
  if (!photo) throw AppError.notFound('That photo');
  return photo;
}

export async function savePhoto(
  uploads: Uploads,
  input: { gardenId: number; plantingId: number; userId: number; buffer: Buffer; caption: string; takenOn: string },
) {
  await plantingOf(input.gardenId, input.plantingId);
  const { data, info } = await cleanImage(input.buffer, uploads);
  await mkdir(photoDir(uploads), { recursive: true, mode: 0o700 });
  const storageName = `${randomBytes(24).toString('base64url')}.jpg`;
  const file = photoPath(uploads, storageName);
  await writeFile(file, data, { flag: 'wx', mode: 0o600 });
  try {
    const id = await inTransaction(PlantingPhoto.sequelize!, async (transaction) => {
      await plantingOf(input.gardenId, input.plantingId, transaction);
      const photo = await PlantingPhoto.create(
        {
          gardenId: input.gardenId,
          plantingId: input.plantingId,
          storageName,
          width: info.width,
          height: info.height,
          bytes: info.size,
          caption: input.caption,
          takenOn: input.takenOn,
          createdBy: input.userId,
        },
        { transaction },
      );
      await PlantingLog.create(
        {
          gardenId: input.gardenId,
          plantingId: input.plantingId,
          entryOn: input.takenOn,
          kind: 'photo',
          amount: null,
          amountUnit: null,
          note: input.caption,
          photoId: photo.id,
          createdBy: input.userId,
        },
        { transaction },
      );
      return photo.id;
    });
    return getPhoto(input.gardenId, input.plantingId, id);
  } catch (err) {
    await unlink(file).catch(() => undefined);
    throw err;
  }
}

export async function deletePhoto(uploads: Uploads, gardenId: number, plantingId: number, photoId: number) {
  const photo = await getPhoto(gardenId, plantingId, photoId);
  await inTransaction(PlantingPhoto.sequelize!, async (transaction) => {
    await PlantingLog.destroy({ where: { photoId: photo.id, kind: 'photo' }, transaction });
    await photo.destroy({ transaction });
  });
  await removePhotoFiles(uploads, [photo.storageName]);
}

/** After the rows are gone; a file that is already missing is no error. */
export async function removePhotoFiles(uploads: Uploads, names: string[]) {
  await Promise.all(names.map((n) => unlink(photoPath(uploads, n)).catch(() => undefined)));
}
