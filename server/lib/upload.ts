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
        return reject(refusal(err, field, limits));
      }
      reject(new AppError(400, 'upload_malformed', 'The upload could not be read as a multipart form.'));
    });
  });
}

/**
 * A multer limit in words. Only a limit that belongs to one named field is reported against it:
 * the counts (files, fields, parts) are about the whole form, and multer names no field for them.
 */
function refusal(err: multer.MulterError, fileField: string, limits: UploadLimits): AppError {
  const whole = (message: string) => new AppError(400, 'upload_rejected', `The upload was refused: ${message}`);
  const named = (name: string, message: string) => new AppError(400, 'upload_rejected', `The upload was refused: ${message}`, { [name]: message });
  switch (err.code) {
    case 'LIMIT_FILE_COUNT':
      return whole('send one file only.');
    case 'LIMIT_FIELD_COUNT':
      return whole(limits.fields ? `the form has more than ${limits.fields} text field${limits.fields === 1 ? '' : 's'}.` : 'the form takes the file alone, no other fields.');
    case 'LIMIT_PART_COUNT':
      return whole('the form has more parts than the file and its fields.');
    case 'LIMIT_FIELD_KEY':
      return whole('a field name is too long.');
    case 'LIMIT_UNEXPECTED_FILE':
      return err.field && err.field !== fileField
        ? named(err.field, `a file was sent as "${err.field}"; send it as "${fileField}".`)
        : whole('send one file only.');
    case 'LIMIT_FIELD_VALUE':
      return err.field ? named(err.field, 'this field is too long.') : whole('a field is too long.');
    case 'MISSING_FIELD_NAME':
      return whole('a field has no name.');
    default:
      return whole('the form could not be read.');
  }
}

/** The answer to a file that is not text, worded once for every CSV upload; none of its bytes are quoted back. */
export const NOT_TEXT_CSV = 'This file is not a text CSV file.';

/**
 * Whether a file can be text: no control bytes besides tab, line ends, form feed and the old DOS
 * end-of-file mark. Bytes that are not UTF-8 are allowed (older exports write ° in Latin-1);
 * a binary file (an image, a spreadsheet, UTF-16 text) has control bytes or NULs all through it.
 */
export function isTextFile(buffer: Buffer): boolean {
  for (const b of buffer) {
    if ((b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0c && b !== 0x0d && b !== 0x1a) || b === 0x7f) return false;
  }
  return true;
}
