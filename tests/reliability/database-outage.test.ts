import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { startCluster, testClusterOptions } from '../../dev-services/postgres';
import { loadConfig } from '../../server/config';
import { createLogger } from '../../server/lib/logger';
import { createTestApp } from '../setup/test-app';

// Stops the real test cluster mid-run, so this file restarts it (on the same port) whatever happens.
const { port } = startCluster(testClusterOptions());
const restartCluster = () => startCluster({ ...testClusterOptions(), port });
afterAll(() => {
  restartCluster();
});

const app = createTestApp();

async function timed(path: string) {
  const started = performance.now();
  const response = await request(app).get(path);
  return { response, elapsedMs: performance.now() - started };
}

describe('when PostgreSQL goes away and comes back', () => {
  it('answers 503 quickly while it is down and recovers without a restart', async () => {
    expect((await request(app).get('/api/lots')).status).toBe(200);

    restartCluster().stop();

    const lots = await timed('/api/lots');
    expect(lots.response.status).toBe(503);
    expect(apiErrorSchema.parse(lots.response.body).error.code).toBe('database_unavailable');
    expect(lots.response.headers['retry-after']).toBeDefined();
    // The pool's connect timeout is 2 s; a hung request would take the client's whole timeout.
    expect(lots.elapsedMs).toBeLessThan(4000);

    const health = await timed('/api/health');
    expect(health.response.status).toBe(503);
    expect(health.response.body).toMatchObject({ ok: false, db: 'down' });

    restartCluster();

    const recovered = await request(app).get('/api/lots');
    expect(recovered.status).toBe(200);
    expect((await request(app).get('/api/health')).body).toMatchObject({ ok: true, db: 'up' });
  });
});

describe('the log of an outage', () => {
  it('writes one short error line per failed request, with no stack at the error level', async () => {
    const lines: string[] = [];
    const config = loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'info' });
    const logged = createTestApp({ logger: createLogger(config, { write: (line: string) => lines.push(line) }) });
    expect((await request(logged).get('/api/lots?q=before')).status).toBe(200);
    restartCluster().stop();
    try {
      for (const q of ['one', 'two', 'three']) expect((await request(logged).get(`/api/lots?q=${q}`)).status).toBe(503);
    } finally {
      restartCluster();
    }
    const errors = lines.map((line) => JSON.parse(line) as { level: number; msg: string; req?: { url: string } }).filter((line) => line.level >= 50);
    expect(errors.map((line) => line.req?.url)).toEqual(['/api/lots?q=one', '/api/lots?q=two', '/api/lots?q=three']);
    for (const line of lines.filter((text) => (JSON.parse(text) as { level: number }).level >= 50)) {
      expect(line).not.toMatch(/\bat .+:\d+:\d+/);
      expect(line.length, line).toBeLessThan(1_000);
    }
  });
});
