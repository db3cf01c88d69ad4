import { mkdtemp, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { updateConfigFile } from './config-file.js';
import { DEFAULT_SERVER_URL, resolveSettings } from './settings.js';

async function configDir(): Promise<string> {
  return mkdtemp(path.join(tmpdir(), 'clino-settings-'));
}

describe('settings resolve flags > environment > config file > defaults', () => {
  it('uses the defaults when nothing is set', async () => {
    const settings = await resolveSettings({}, { CLINO_CONFIG_DIR: await configDir() });
    expect(settings.serverUrl).toBe(DEFAULT_SERVER_URL);
    expect(settings.token).toBeUndefined();
    expect(settings.logLevel).toBe('info');
  });

  it('takes the config file over the defaults, the environment over the file and the flag over both', async () => {
    const dir = await configDir();
    await updateConfigFile(path.join(dir, 'config.json'), { serverUrl: 'http://file.invalid:1', token: 'from-file', logLevel: 'warn' });
    const fileOnly = await resolveSettings({}, { CLINO_CONFIG_DIR: dir });
    expect([fileOnly.serverUrl, fileOnly.token, fileOnly.logLevel]).toEqual(['http://file.invalid:1', 'from-file', 'warn']);
    const env = { CLINO_CONFIG_DIR: dir, CLINO_SERVER_URL: 'http://env.invalid:2/', CLINO_TOKEN: 'from-env', CLINO_LOG_LEVEL: 'debug' };
    const withEnv = await resolveSettings({}, env);
    expect([withEnv.serverUrl, withEnv.token, withEnv.logLevel]).toEqual(['http://env.invalid:2', 'from-env', 'debug']);
    const withFlags = await resolveSettings({ server: 'http://flag.invalid:3', logLevel: 'error' }, env);
    expect([withFlags.serverUrl, withFlags.logLevel, withFlags.sources.serverUrl]).toEqual(['http://flag.invalid:3', 'error', 'flag']);
  });

  it('takes the outbox folder from --outbox over CLINO_OUTBOX, as an absolute path, and none by default', async () => {
    const dir = await configDir();
    expect((await resolveSettings({}, { CLINO_CONFIG_DIR: dir })).outbox).toBeUndefined();
    const fromEnv = await resolveSettings({}, { CLINO_CONFIG_DIR: dir, CLINO_OUTBOX: 'drop/outbox' });
    expect([fromEnv.outbox, fromEnv.sources.outbox]).toEqual([path.resolve('drop/outbox'), 'environment']);
    const fromFlag = await resolveSettings({ outbox: '/srv/drop/outbox' }, { CLINO_CONFIG_DIR: dir, CLINO_OUTBOX: 'drop/outbox' });
    expect([fromFlag.outbox, fromFlag.sources.outbox]).toEqual(['/srv/drop/outbox', 'flag']);
  });

  it('refuses a server URL that is not http or https, naming where it came from', async () => {
    const attempt = resolveSettings({}, { CLINO_CONFIG_DIR: await configDir(), CLINO_SERVER_URL: 'ftp://x.invalid' });
    await expect(attempt).rejects.toThrow('the server URL "ftp://x.invalid" from the environment is not valid');
  });

  it('writes the config file with mode 0600 in a folder of mode 0700', async () => {
    const dir = path.join(await configDir(), 'nested');
    await updateConfigFile(path.join(dir, 'config.json'), { token: 'secret' });
    expect((await stat(path.join(dir, 'config.json'))).mode & 0o777).toBe(0o600);
    expect((await stat(dir)).mode & 0o777).toBe(0o700);
  });
});
