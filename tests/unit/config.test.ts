import { describe, expect, it } from 'vitest';
import { ConfigError, parseConfig } from '../../server/config';

const base = { DATABASE_URL: 'postgres://u@127.0.0.1:5/db', BETTER_AUTH_SECRET: 'x'.repeat(32) };

describe('parseConfig', () => {
  it('fills defaults and derives the base URL from host and port', () => {
    const c = parseConfig(base);
    expect(c.PORT).toBe(3000);
    expect(c.BASE_URL).toBe('http://127.0.0.1:3000');
  });

  it('uses https in the derived base URL when a certificate is given', () => {
    const c = parseConfig({ ...base, TLS_CERT: '/c.pem', TLS_KEY: '/k.pem', HOST: '0.0.0.0', PORT: '8443' });
    expect(c.BASE_URL).toBe('https://0.0.0.0:8443');
  });

  it('fails fast naming each bad variable', () => {
    const bad = () => parseConfig({ ...base, PORT: 'eighty', BETTER_AUTH_SECRET: 'short' });
    expect(bad).toThrow(ConfigError);
    expect(bad).toThrow(/PORT: /);
    expect(bad).toThrow(/BETTER_AUTH_SECRET: must be at least 32 characters/);
    expect(() => parseConfig({})).toThrow(/DATABASE_URL: /);
  });

  it('refuses a certificate without its key', () => {
    expect(() => parseConfig({ ...base, TLS_CERT: '/c.pem' })).toThrow(/TLS_KEY: TLS_CERT and TLS_KEY must be given together/);
  });

  it('logs JSON in production and short readable lines elsewhere, unless LOG_FORMAT says otherwise', () => {
    expect(parseConfig({ ...base, NODE_ENV: 'production' }).LOG_FORMAT).toBe('json');
    expect(parseConfig({ ...base, NODE_ENV: 'development' }).LOG_FORMAT).toBe('pretty');
    expect(parseConfig(base).LOG_FORMAT).toBe('pretty');
    expect(parseConfig({ ...base, NODE_ENV: 'production', LOG_FORMAT: 'pretty' }).LOG_FORMAT).toBe('pretty');
    expect(parseConfig({ ...base, NODE_ENV: 'development', LOG_FORMAT: 'json' }).LOG_FORMAT).toBe('json');
    expect(() => parseConfig({ ...base, LOG_FORMAT: 'yaml' })).toThrow(/LOG_FORMAT: /);
  });

  it('believes no X-Forwarded-For unless a proxy is named, and refuses `true`', () => {
    expect(parseConfig(base).TRUST_PROXY).toBe('false');
    expect(parseConfig({ ...base, TRUST_PROXY: '10.0.0.0/8' }).TRUST_PROXY).toBe('10.0.0.0/8');
    expect(() => parseConfig({ ...base, TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY: name the proxy/);
  });
});
