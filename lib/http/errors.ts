/** The closed set of error codes the application may raise, and their HTTP statuses. */
export const ERROR_STATUS = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unprocessable: 422,
  too_many_requests: 429,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

/** Field-level problems: field path → messages (shown under each input). */
export type FieldErrors = Record<string, string[]>;

/** The one error type of the application. Services throw it; edges map it to HTTP. */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details: Record<string, unknown> | undefined;
  readonly fieldErrors: FieldErrors | undefined;

  constructor(code: ErrorCode, message: string, opts: { details?: Record<string, unknown>; fieldErrors?: FieldErrors } = {}) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.details = opts.details;
    this.fieldErrors = opts.fieldErrors;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}
