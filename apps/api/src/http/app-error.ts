import type { DataIssue, ErrorCode, FieldError } from '@millrace/contracts';

/**
 * The one application error type: thrown anywhere, turned into the JSON error body by the
 * error handler. `code` is one of the contract's error codes.
 */
export class AppError extends Error {
  readonly status: number;
  readonly code: ErrorCode;
  readonly fields?: FieldError[];
  readonly issues?: DataIssue[];
  /** Extra response headers (e.g. Retry-After). */
  readonly headers?: Record<string, string>;

  constructor(
    status: number,
    code: ErrorCode,
    message: string,
    options: { fields?: FieldError[]; issues?: DataIssue[]; headers?: Record<string, string> } = {},
  ) {
    super(message);
    this.name = 'AppError';
    this.status = status;
    this.code = code;
    this.fields = options.fields;
    this.issues = options.issues;
    this.headers = options.headers;
  }

  static notFound(message: string): AppError {
    return new AppError(404, 'not_found', message);
  }

  static conflict(message: string): AppError {
    return new AppError(409, 'conflict', message);
  }

  static validation(message: string, fields: FieldError[]): AppError {
    return new AppError(400, 'validation_failed', message, { fields });
  }

  static unprocessable(message: string, issues: DataIssue[]): AppError {
    return new AppError(422, 'unprocessable', message, { issues });
  }
}
