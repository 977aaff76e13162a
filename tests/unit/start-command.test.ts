import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';

describe('npm start with a bad setting', () => {
  it('stops before starting anything, with a message that names the key', { timeout: 30_000 }, () => {
    const result = spawnSync(process.execPath, ['--import', 'tsx', 'dev-services/start.ts'], {
      env: { ...process.env, PORT: 'abc' },
      encoding: 'utf8',
      timeout: 30_000,
    });
    expect(result.status).toBe(1);
    expect(result.stderr).toContain('PORT must be a whole number from 1 to 65535 (got "abc")');
    expect(result.stdout).not.toContain('Restday is running');
  });
});
