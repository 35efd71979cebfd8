import { describe, expect, it } from 'vitest';
import { EnvError, loadEnv } from '#server/env.ts';

describe('environment validation', () => {
  it('gives safe local defaults when nothing is set', () => {
    const env = loadEnv({});
    expect(env.HOST).toBe('127.0.0.1');
    expect(env.PORT).toBe(3000);
    expect(env.DATABASE_URL).toMatch(/^postgres:\/\/postgres@127\.0\.0\.1:\d+\/etchwell$/);
  });

  it('reads overrides, coercing numbers', () => {
    expect(loadEnv({ PORT: '4100' }).PORT).toBe(4100);
  });

  it('treats an empty variable as unset', () => {
    expect(loadEnv({ PORT: '' }).PORT).toBe(3000);
  });

  it.each([
    ['PORT', 'abc'],
    ['PORT', '70000'],
    ['DATABASE_URL', 'mysql://127.0.0.1/etchwell'],
    ['DATABASE_URL', 'not a url'],
    ['LOG_LEVEL', 'loud'],
    ['NODE_ENV', 'staging'],
    ['JSON_BODY_LIMIT', 'lots'],
  ])('rejects %s=%s with a message naming the variable', (name, value) => {
    expect(() => loadEnv({ [name]: value })).toThrow(EnvError);
    expect(() => loadEnv({ [name]: value })).toThrow(new RegExp(`^Invalid environment:\\n  ${name}: `));
  });

  it('names every bad variable at once', () => {
    try {
      loadEnv({ PORT: 'x', LOG_LEVEL: 'y' });
      expect.unreachable();
    } catch (error) {
      expect((error as Error).message).toContain('PORT');
      expect((error as Error).message).toContain('LOG_LEVEL');
    }
  });
});
