import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config';

describe('loadConfig', () => {
  it('gives working defaults for a bare environment', () => {
    const config = loadConfig({});
    expect(config).toMatchObject({ PORT: 3000, HOST: '127.0.0.1', NODE_ENV: 'development', RESTDAY_TEST_CLOCK: false });
  });

  it.each([['abc'], ['0'], ['70000'], ['3000.5']])('refuses PORT=%s and names the key', (port) => {
    expect(() => loadConfig({ PORT: port })).toThrow(ConfigError);
    expect(() => loadConfig({ PORT: port })).toThrow(/PORT must be a whole number/);
  });

  it('refuses the test clock, the development secret and a missing public URL in production', () => {
    try {
      loadConfig({ NODE_ENV: 'production', RESTDAY_TEST_CLOCK: 'true' });
      expect.unreachable();
    } catch (error) {
      expect((error as ConfigError).problems.map((problem) => problem.key).sort()).toEqual(['PUBLIC_URL', 'RESTDAY_TEST_CLOCK', 'SESSION_SECRET']);
    }
  });

  it('never repeats a secret value in its message', () => {
    expect(() => loadConfig({ SESSION_SECRET: 'short-secret' })).toThrow(/^(?!.*short-secret).*SESSION_SECRET/);
  });
});
