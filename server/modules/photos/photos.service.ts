import { randomBytes } from 'node:crypto';
import { readFile, unlink } from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import type { Metadata } from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import type { AppConfig } from '../../config';
import { Planting, PlantingLog, PlantingPhoto, User } from '../../db/models';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import { QueryTypes } from 'sequelize';
import type { Transaction } from 'sequelize';

const ACCEPTED = new Set(['image/jpeg', 'image/png', 'image/webp']);
/** Longest edge kept: plenty for a bed photo on any screen, a fraction of a phone camera's file. */
const MAX_EDGE = 2048;
/**
 * The most a stored (re-encoded) photo may weigh. A 2048-pixel JPEG at quality 82 is far below it;
 * the bound keeps one row well inside max_allowed_packet and a Galera write set.
 */
export const MAX_STORED_BYTES = 6 * 1024 * 1024;

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

/**
 * Photos live in the database (`planting_photo_contents`, migration 0025), written in the same
 * transaction as the photo row, so every instance serves every photo and a failed insert leaves
 * nothing behind. `storage_name` stays a random name: photos from before 0025 are files under
 * UPLOADS_DIR with that name, still served and removed.
 */
export async function savePhoto(
  uploads: Uploads,
  input: { gardenId: number; plantingId: number; userId: number; buffer: Buffer; caption: string; takenOn: string },
) {
  await plantingOf(input.gardenId, input.plantingId);
  const { data, info } = await cleanImage(input.buffer, uploads);
  if (data.length > MAX_STORED_BYTES) {
    throw new AppError(413, 'image_too_large', 'The photo is too large to keep, even re-encoded.', { photo: 'The photo is too large.' });
  }
  const storageName = `${randomBytes(24).toString('base64url')}.jpg`;
  const sequelize = PlantingPhoto.sequelize!;
  const id = await inTransaction(sequelize, async (transaction) => {
    await plantingOf(input.gardenId, input.plantingId, transaction);
    const photo = await PlantingPhoto.create(
      {
        gardenId: input.gardenId,
        plantingId: input.plantingId,
        storageName,
        width: info.width,
        height: info.height,
        bytes: data.length,
        caption: input.caption,
        takenOn: input.takenOn,
        createdBy: input.userId,
      },
      { transaction },
    );
    await sequelize.query('INSERT INTO planting_photo_contents (photo_id, data, created_at) VALUES (?, ?, UTC_TIMESTAMP(3))', {
      replacements: [photo.id, data],
      transaction,
    });
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
}

/** The stored JPEG of a photo: from the database, or for a photo from before 0025 its file; null when neither. */
export async function photoContent(uploads: Uploads, photo: { id: number; storageName: string }): Promise<Buffer | null> {
  const [row] = await PlantingPhoto.sequelize!.query<{ data: Buffer }>('SELECT data FROM planting_photo_contents WHERE photo_id = ?', {
    replacements: [photo.id],
    type: QueryTypes.SELECT,
  });
  if (row) return row.data;
  return readFile(photoPath(uploads, photo.storageName)).catch(() => null);
}

export async function deletePhoto(uploads: Uploads, gardenId: number, plantingId: number, photoId: number) {
  const photo = await getPhoto(gardenId, plantingId, photoId);
  // The stored content goes with the photo row (ON DELETE CASCADE).
  await inTransaction(PlantingPhoto.sequelize!, async (transaction) => {
    await PlantingLog.destroy({ where: { photoId: photo.id, kind: 'photo' }, transaction });
    await photo.destroy({ transaction });
  });
  await removePhotoFiles(uploads, [photo.storageName]);
}

/** After the rows are gone: files of photos from before 0025; a file that is missing (the usual case) is no error. */
export async function removePhotoFiles(uploads: Uploads, names: string[]) {
  await Promise.all(names.map((n) => unlink(photoPath(uploads, n)).catch(() => undefined)));
}
