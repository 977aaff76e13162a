import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { createTestApp } from '../setup/test-app';

const app = createTestApp();

describe('HTTP basics', () => {
  it('GET /api/health reports the database up', async () => {
    const response = await request(app).get('/api/health');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ ok: true, db: 'up', queue: 'stopped' });
  });

  it('an unknown /api route is a JSON 404, never the SPA', async () => {
    const response = await request(app).get('/api/nothing-here');
    expect(response.status).toBe(404);
    expect(response.type).toBe('application/json');
    expect(apiErrorSchema.parse(response.body).error.code).toBe('route_not_found');
  });

  it('a state-changing request without X-Restday-Client is refused with 403', async () => {
    const response = await request(app).post('/api/lots').send({});
    expect(response.status).toBe(403);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('client_header_required');
  });

  it('malformed JSON is a 400 with the error shape, not a 500', async () => {
    const response = await request(app).post('/api/nothing-here').set('X-Restday-Client', 'web').set('Content-Type', 'application/json').send('{"broken":');
    expect(response.status).toBe(400);
    expect(apiErrorSchema.parse(response.body).error.code).toBe('invalid_json');
  });

  it('every response carries a request id and a strict content security policy', async () => {
    const response = await request(app).get('/api/health').set('X-Request-Id', 'lb-1234567890');
    expect(response.headers['x-request-id']).toBe('lb-1234567890');
    const csp = response.headers['content-security-policy'];
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(response.headers['x-content-type-options']).toBe('nosniff');
  });
});
