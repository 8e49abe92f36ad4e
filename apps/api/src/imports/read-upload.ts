import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from '../http/app-error';
import { importLimits, maxFileMegabytes } from './import-limits';

/** An uploaded file, kept in memory (never on disk) up to the size limit. */
export interface Upload {
  fileName: string;
  bytes: Buffer;
}

const upload = multer({
  storage: multer.memoryStorage(),
  // Keep the name as sent (with any folders) so a name with path characters is refused, not silently cut.
  preservePath: true,
  limits: { fileSize: importLimits.maxFileBytes, files: 1, fields: 8, fieldSize: 64 * 1024, parts: 10 },
}).single('file');

const multerMessages: Record<string, string> = {
  LIMIT_FILE_SIZE: `The file is larger than the ${maxFileMegabytes} MB limit; split it or remove unused sheets.`,
  LIMIT_FILE_COUNT: 'Upload one file at a time.',
  LIMIT_UNEXPECTED_FILE: 'Send the file in the form field "file".',
  LIMIT_FIELD_VALUE: 'A form field is too long.',
  LIMIT_FIELD_COUNT: 'The form has too many fields.',
  LIMIT_PART_COUNT: 'The form has too many parts.',
};

/**
 * Reads a multipart upload (field `file`, plus text fields) into memory with multer. Over the
 * limit → 413 naming the limit; a broken form → 400. Multer stops reading at the limit, so a
 * huge upload never fills the memory.
 */
export const readUpload: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      const message = multerMessages[err.code] ?? 'The upload could not be read.';
      return next(err.code === 'LIMIT_FILE_SIZE' ? new AppError(413, 'payload_too_large', message, { fields: [{ path: 'file', message }] }) : AppError.validation(message, [{ path: 'file', message }]));
    }
    next(AppError.validation('The upload could not be read; send the file as multipart/form-data.', [{ path: 'file', message: 'The upload could not be read.' }]));
  });
};

/** The uploaded file, checked: present, not empty, a plain file name. */
export function uploadedFile(file: Express.Multer.File | undefined): Upload {
  if (!file) throw AppError.validation('Attach a CSV or XLSX file in the form field "file".', [{ path: 'file', message: 'Attach a file.' }]);
  const fileName = file.originalname;
  // eslint-disable-next-line no-control-regex
  if (/[/\\]|\.\.|[\u0000-\u001f]|^[a-zA-Z]:/.test(fileName)) {
    const message = `The file name "${fileName.replace(/[\u0000-\u001f]/g, '?')}" contains path characters (/, \\, .. or a drive); upload it under a plain name such as bom.xlsx.`;
    throw AppError.validation(message, [{ path: 'file', message }]);
  }
  if (fileName.trim() === '' || fileName.length > importLimits.maxFileNameLength) {
    const message = `Give the file a name of 1 to ${importLimits.maxFileNameLength} characters.`;
    throw AppError.validation(message, [{ path: 'file', message }]);
  }
  if (file.size === 0) throw AppError.validation('The file is empty.', [{ path: 'file', message: 'The file is empty.' }]);
  return { fileName, bytes: file.buffer };
}
