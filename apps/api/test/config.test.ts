import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../src/config';

describe('configuration', () => {
  it('when only the database name and user are set, then the documented defaults apply', () => {
    const config = loadConfig({ DB_NAME: 'millrace', DB_USER: 'millrace' });
    expect(config.http).toEqual({ host: '127.0.0.1', port: 8080, publicUrl: 'http://127.0.0.1:8080' });
    expect(config.db).toMatchObject({ host: '127.0.0.1', name: 'millrace', user: 'millrace', password: '' });
    expect(config.smtp.secure).toBe(false);
    expect(config.plannerDist).toBeUndefined();
  });

  it('when variables are bad or missing, then one ConfigError names every one of them', () => {
    let error: unknown;
    try {
      loadConfig({ DB_PORT: 'abc', PORT: '70000', PUBLIC_URL: 'not a url', SMTP_SECURE: 'maybe' });
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(ConfigError);
    const message = (error as Error).message;
    for (const name of ['DB_NAME', 'DB_USER', 'DB_PORT', 'PORT', 'PUBLIC_URL', 'SMTP_SECURE']) expect(message).toContain(name);
  });

  it('when PUBLIC_URL ends with a slash or empty strings are given, then it is trimmed and defaults still apply', () => {
    const config = loadConfig({ DB_NAME: 'm', DB_USER: 'u', PUBLIC_URL: 'https://plan.example.com/', PORT: '' });
    expect(config.http.publicUrl).toBe('https://plan.example.com');
    expect(config.http.port).toBe(8080);
  });
});
