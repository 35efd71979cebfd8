import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { AppError, errorBodySchema } from '#shared/errors.ts';
import { toAppError } from '#server/middleware/error-handler.ts';

describe('AppError', () => {
  it('carries the status of its code and a body in the shared shape', () => {
    const error = new AppError('CONFLICT', 'That move is not allowed.');
    expect(error.status).toBe(409);
    expect(errorBodySchema.parse(error.toBody())).toEqual({ code: 'CONFLICT', message: 'That move is not allowed.' });
  });

  it('turns a zod failure into VALIDATION_FAILED with one issue per field', () => {
    const result = z.object({ name: z.string().min(1), size: z.number() }).safeParse({ name: '', size: 'big' });
    const error = toAppError(result.error);
    expect(error.status).toBe(400);
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(error.issues?.map((i) => i.path.join('.'))).toEqual(['name', 'size']);
  });

  it('hides the message of an unexpected error behind a plain one', () => {
    const error = toAppError(new Error('connect ECONNREFUSED 127.0.0.1:5432 password=secret'));
    expect(error.status).toBe(500);
    expect(error.message).not.toContain('secret');
    expect(error.cause).toBeInstanceOf(Error);
  });
});
