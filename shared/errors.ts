import { z } from 'zod';

/**
 * The error codes the API answers with. Each maps to one HTTP status, so the server and the
 * client agree on what a code means without either side repeating the table.
 */
export const APP_ERROR_STATUS = {
  BAD_REQUEST: 400,
  VALIDATION_FAILED: 400,
  UNAUTHENTICATED: 401,
  FORBIDDEN: 403,
  NOT_FOUND: 404,
  CONFLICT: 409,
  PAYLOAD_TOO_LARGE: 413,
  UNSUPPORTED_MEDIA_TYPE: 415,
  RATE_LIMITED: 429,
  INTERNAL: 500,
  SERVICE_UNAVAILABLE: 503,
} as const;

export type AppErrorCode = keyof typeof APP_ERROR_STATUS;

export const appErrorCodeSchema = z.enum(Object.keys(APP_ERROR_STATUS) as [AppErrorCode, ...AppErrorCode[]]);

/** One problem with one input field, as zod reports it. */
export const fieldIssueSchema = z.object({
  path: z.array(z.union([z.string(), z.number()])),
  message: z.string(),
});
export type FieldIssue = z.infer<typeof fieldIssueSchema>;

/** The JSON body of every error the API answers. */
export const errorBodySchema = z.object({
  code: appErrorCodeSchema,
  message: z.string(),
  issues: z.array(fieldIssueSchema).optional(),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;

/**
 * The one error type of the project. Server code throws it; the error handler turns it into
 * `{ code, message, issues? }`; the client's api-client turns that body back into an AppError.
 * `message` is always safe to show to the person using the product.
 */
export class AppError extends Error {
  readonly code: AppErrorCode;
  readonly status: number;
  readonly issues?: FieldIssue[];
  /** For RATE_LIMITED and SERVICE_UNAVAILABLE: when to try again (the Retry-After header). */
  readonly retryAfterSeconds?: number;

  constructor(code: AppErrorCode, message: string, options: { issues?: FieldIssue[]; cause?: unknown; retryAfterSeconds?: number } = {}) {
    super(message, { cause: options.cause });
    this.name = 'AppError';
    this.code = code;
    this.status = APP_ERROR_STATUS[code];
    this.issues = options.issues;
    this.retryAfterSeconds = options.retryAfterSeconds;
  }

  toBody(): ErrorBody {
    return this.issues ? { code: this.code, message: this.message, issues: this.issues } : { code: this.code, message: this.message };
  }
}
