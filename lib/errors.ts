// One error type for expected failures, mapped once to HTTP status and form messages.
export type AppErrorCode =
  | 'BAD_INPUT'
  | 'UNAUTHENTICATED'
  | 'FORBIDDEN'
  | 'NOT_FOUND'
  | 'CONFLICT'
  | 'RATE_LIMITED'
  | 'UNAVAILABLE'
  | 'TOO_LARGE';

const STATUS: Record<AppErrorCode, number> = {
  BAD_INPUT: 400,
  UNAUTHENTICATED: 401,
  FORBIDDEN: 403,
  NOT_FOUND: 404,
  CONFLICT: 409,
  TOO_LARGE: 413,
  RATE_LIMITED: 429,
  UNAVAILABLE: 503,
};

export class AppError extends Error {
  readonly code: AppErrorCode;
  readonly fieldErrors?: Record<string, string[]>;

  constructor(code: AppErrorCode, message: string, fieldErrors?: Record<string, string[]>) {
    super(message);
    this.name = 'AppError';
    this.code = code;
    this.fieldErrors = fieldErrors;
  }

  get status(): number {
    return STATUS[this.code];
  }
}

export const DATABASE_UNAVAILABLE_MESSAGE =
  'The database is unavailable right now. Nothing was saved; please try again in a moment.';
