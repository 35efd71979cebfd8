import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { errorBodySchema } from '#shared/errors.ts';
import { useTestApp } from '../support/test-app.ts';

describe('API error answers', () => {
  const t = useTestApp({ JSON_BODY_LIMIT: '1kb' });

  it('answers an unknown API route with 404 JSON, not the client page', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(errorBodySchema.parse(res.body)).toEqual({ code: 'NOT_FOUND', message: 'There is no API route GET /api/no-such-thing.' });
  });

  it('answers an unknown API route for any method', async () => {
    const res = await request(t.app).delete('/api/storefront').expect(404);
    expect(res.body.code).toBe('NOT_FOUND');
  });

  it('answers a malformed JSON body with 400 JSON and no stack trace', async () => {
    const res = await request(t.app)
      .post('/api/storefront/harbour-light')
      .set('content-type', 'application/json')
      .send('{"name": ')
      .expect(400);
    expect(errorBodySchema.parse(res.body)).toEqual({ code: 'BAD_REQUEST', message: 'The request body is not valid JSON.' });
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.js|SyntaxError/);
  });

  it('answers a body over the limit with 413', async () => {
    const res = await request(t.app)
      .post('/api/storefront/harbour-light')
      .set('content-type', 'application/json')
      .send(JSON.stringify({ text: 'x'.repeat(2048) }))
      .expect(413);
    expect(res.body.code).toBe('PAYLOAD_TOO_LARGE');
  });

  it('gives every response a request id, echoing a well-formed incoming one', async () => {
    const res = await request(t.app).get('/api/health').set('x-request-id', 'trace-123').expect(200);
    expect(res.headers['x-request-id']).toBe('trace-123');
    const fresh = await request(t.app).get('/api/health').set('x-request-id', 'bad id with spaces');
    expect(fresh.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('sends security headers with a script policy that allows no inline script', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
    expect(res.headers['content-security-policy']).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
