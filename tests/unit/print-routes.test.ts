import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, it } from 'vitest';
import type { RouteRow } from '../../server/lib/route-table';

const run = promisify(execFile);
let routes: RouteRow[];

describe('npm run routes', () => {
  beforeAll(async () => {
    // The script itself, as a developer runs it: it builds the app without a database or a listener.
    const { stdout } = await run(process.execPath, ['--import', 'tsx', 'server/scripts/print-routes.ts', '--json'], {
      env: { ...process.env, NODE_ENV: 'test' },
    });
    routes = JSON.parse(stdout) as RouteRow[];
  }, 60_000);

  it('lists known routes with their access rule and the file that serves them', () => {
    const row = (method: string, path: string) => routes.find((route) => route.method === method && route.path === path);
    expect(row('GET', '/api/lots')).toEqual({ method: 'GET', path: '/api/lots', access: 'public', file: 'server/modules/lots/lots.routes.ts' });
    expect(row('GET', '/api/orders/:id')).toMatchObject({ access: 'customer', file: 'server/modules/orders/orders.routes.ts' });
    expect(row('POST', '/api/orders/:id/refund')).toMatchObject({ access: 'owner', file: 'server/modules/orders/orders.routes.ts' });
    expect(row('GET', '/api/roastery/days/:date/roast-list')).toMatchObject({ access: 'staff', file: 'server/modules/roastery/roastery.routes.ts' });
    expect(row('GET', '/api/roastery/days/:date/pack-list')).toMatchObject({ access: 'packer', file: 'server/modules/packing/packing.routes.ts' });
    // A guard on the whole router (`router.use(requireUser)`) counts for every route after it.
    expect(row('PATCH', '/api/account/profile')).toMatchObject({ access: 'customer', file: 'server/modules/account/account.routes.ts' });
    expect(row('GET', '/api/owner/team')).toMatchObject({ access: 'owner', file: 'server/modules/team/team.routes.ts' });
  });

  it('gives every route an access rule and a file under server/modules', () => {
    expect(routes.length).toBeGreaterThan(50);
    for (const route of routes) {
      expect(['public', 'customer', 'packer', 'staff', 'owner']).toContain(route.access);
      expect(route.file).toMatch(/^server\/modules\/[a-z-]+\/[a-z-]+\.routes\.ts$/);
    }
  });
});
