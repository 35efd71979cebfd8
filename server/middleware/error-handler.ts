import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { NotFoundError } from '@mikro-orm/core';
import { AppError } from '#shared/errors.ts';

/** body-parser marks its own failures with a `type`; map the ones a client can cause. */
function fromBodyParser(error: { type?: string; limit?: number }): AppError | undefined {
  switch (error.type) {
    case 'entity.parse.failed':
      return new AppError('BAD_REQUEST', 'The request body is not valid JSON.');
    case 'entity.too.large':
      return new AppError(
        'PAYLOAD_TOO_LARGE',
        `The request body is larger than the ${error.limit ?? ''} bytes allowed.`.replace('  ', ' '),
      );
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new AppError('UNSUPPORTED_MEDIA_TYPE', 'The request body uses an encoding the server does not accept.');
    default:
      return undefined;
  }
}

/** Turns anything thrown into an AppError; unknown errors become INTERNAL with a plain message. */
export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  if (error instanceof ZodError) {
    return new AppError('VALIDATION_FAILED', 'Some fields are not valid.', {
      issues: error.issues.map((issue) => ({
        path: issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p)),
        message: issue.message,
      })),
    });
  }
  if (error instanceof NotFoundError) return new AppError('NOT_FOUND', 'Not found.');
  if (error && typeof error === 'object') {
    const mapped = fromBodyParser(error as { type?: string; limit?: number });
    if (mapped) return mapped;
  }
  return new AppError('INTERNAL', 'Something went wrong on our side. Please try again.', { cause: error });
}

/** The one place errors become responses: `{ code, message, issues? }` with the code's status. */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  const appError = toAppError(error);
  if (appError.status >= 500) req.log.error({ err: appError.cause ?? appError }, appError.message);
  else req.log.info({ code: appError.code }, appError.message);
  if (res.headersSent) return;
  if (appError.retryAfterSeconds) res.set('retry-after', String(appError.retryAfterSeconds));
  res.status(appError.status).json(appError.toBody());
};

/** Any /api path no router answered. */
export const apiNotFound: RequestHandler = (req) => {
  throw new AppError('NOT_FOUND', `There is no API route ${req.method} ${req.originalUrl}.`);
};
