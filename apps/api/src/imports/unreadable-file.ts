import { AppError } from '../http/app-error';

/** 400 for an upload that cannot be read as a table; nothing has been written. */
export function unreadableFile(message: string): AppError {
  return AppError.validation(message, [{ path: 'file', message }]);
}

/** 413 for a file with more rows or columns than an import takes. */
export function tooLarge(message: string): AppError {
  return new AppError(413, 'payload_too_large', message, { fields: [{ path: 'file', message }] });
}
