import path from 'node:path';
import { ConfigError, configDocs, loadConfig, servesDevOutbox, usesTls } from './config';

describe('loadConfig', () => {
  it('runs with nothing set, using the documented defaults', () => {
    const config = loadConfig({});
    expect(config).toMatchObject({
      nodeEnv: 'development',
      port: 4300,
      host: '127.0.0.1',
      dataDir: path.resolve('data'),
      databasePath: path.resolve('data', 'taulens.sqlite'),
      publicUrl: 'http://localhost:4300',
      smtp: { host: 'localhost', port: 587, from: 'Taulens <no-reply@taulens.local>' },
      fakeSmtp: true,
      fakeSmtpPort: 0,
      uploadLimitMb: 1024,
      trustProxy: false,
      logLevel: 'info',
      seedDemo: true,
      webRoot: path.resolve('dist/web/browser'),
    });
    expect(config.sessionSecret).toBeUndefined();
  });

  it('turns the fake SMTP server and the demo seed off in production', () => {
    expect(loadConfig({ NODE_ENV: 'production' })).toMatchObject({ fakeSmtp: false, seedDemo: false });
    expect(loadConfig({ NODE_ENV: 'test' })).toMatchObject({ fakeSmtp: true, seedDemo: false });
  });

  it('derives the database path and public URL from DATA_DIR and PORT unless they are set', () => {
    expect(loadConfig({ DATA_DIR: '/srv/tl', PORT: '8080' })).toMatchObject({
      databasePath: '/srv/tl/taulens.sqlite',
      publicUrl: 'http://localhost:8080',
    });
    expect(loadConfig({ DATABASE_PATH: '/db/x.sqlite', PUBLIC_URL: 'https://tl.example.org/' })).toMatchObject({
      databasePath: '/db/x.sqlite',
      publicUrl: 'https://tl.example.org',
    });
  });

  it('lets overrides win and feed the derived defaults', () => {
    const config = loadConfig({ DATA_DIR: '/env/dir', PORT: '5000' }, { dataDir: '/override', port: 0 });
    expect(config).toMatchObject({ dataDir: '/override', databasePath: '/override/taulens.sqlite', port: 0 });
  });

  it('reads booleans, numbers and trust-proxy values, and treats empty values as unset', () => {
    expect(loadConfig({ FAKE_SMTP: 'false', SEED_DEMO: 'yes', PORT: '' })).toMatchObject({ fakeSmtp: false, seedDemo: true, port: 4300 });
    expect(loadConfig({ TRUST_PROXY: 'true' }).trustProxy).toBe(true);
    expect(loadConfig({ TRUST_PROXY: '2' }).trustProxy).toBe(2);
    expect(loadConfig({ TRUST_PROXY: 'loopback' }).trustProxy).toBe('loopback');
  });

  it('rejects bad values with one message naming every broken key', () => {
    const attempt = () => loadConfig({ PORT: 'eighty', SESSION_SECRET: 'short', LOG_LEVEL: 'loud', PUBLIC_URL: 'ftp://x' });
    expect(attempt).toThrow(ConfigError);
    const message = (() => {
      try {
        attempt();
        return '';
      } catch (error) {
        return (error as Error).message;
      }
    })();
    expect(message).toMatch(/^Invalid configuration:/);
    for (const key of ['PORT', 'SESSION_SECRET', 'LOG_LEVEL', 'PUBLIC_URL']) expect(message).toContain(`  ${key}: `);
    expect(message).toContain('at least 32 characters');
  });

  it('documents every key with a default and a description', () => {
    for (const [key, doc] of Object.entries(configDocs)) {
      expect({ key, default: doc.default.length > 0, description: doc.description.length > 10 }).toEqual({
        key,
        default: true,
        description: true,
      });
    }
  });
});

describe('servesDevOutbox', () => {
  it('serves the outbox of caught mail only outside production, with the fake SMTP server on', () => {
    expect(servesDevOutbox(loadConfig({}))).toBe(true);
    expect(servesDevOutbox(loadConfig({ FAKE_SMTP: 'false' }))).toBe(false);
    expect(servesDevOutbox(loadConfig({ NODE_ENV: 'production', FAKE_SMTP: 'true' }))).toBe(false);
  });
});

describe('usesTls', () => {
  it('follows the public address', () => {
    expect(usesTls({ publicUrl: 'https://tl.example.org' })).toBe(true);
    expect(usesTls({ publicUrl: 'http://localhost:4300' })).toBe(false);
  });
});
