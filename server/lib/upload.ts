import multer from 'multer';
import type { Request, Response } from 'express';
import { AppError } from '../errors';

export interface UploadLimits {
  maxBytes: number;
  /** Text fields besides the file. */
  fields: number;
}

/**
 * One file in memory with every multer limit set (size, files, fields, parts, names, headers):
 * malformed or oversized multipart bodies become 400/413 answers instead of crashes.
 */
export function receiveOneFile(req: Request, res: Response, field: string, limits: UploadLimits): Promise<Express.Multer.File | undefined> {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: limits.maxBytes,
      files: 1,
      fields: limits.fields,
      parts: limits.fields + 1,
      fieldNameSize: 100,
      fieldSize: 4096,
      headerPairs: 50,
    },
  }).single(field);
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (!err) return resolve(req.file);
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return reject(new AppError(413, 'file_too_large', `The file is larger than ${Math.round(limits.maxBytes / 1024 / 1024 * 10) / 10} MB.`));
        }
        return reject(new AppError(400, 'upload_rejected', `The upload was refused: ${err.message}.`, { [err.field ?? field]: err.message }));
      }
      reject(new AppError(400, 'upload_malformed', 'The upload could not be read as a multipart form.'));
    });
  });
}
