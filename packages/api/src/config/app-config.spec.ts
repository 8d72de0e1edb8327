import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from './app-config';

const production = {
  JWT_SECRET: 'x'.repeat(40),
  LIMBUS_ADMIN_EMAIL: 'Head@Example.org',
  LIMBUS_ADMIN_PASSWORD: 'a-long-enough-password',
  DB_PORT: '3306',
  DB_NAME: 'limbus',
  DB_USER: 'limbus',
  DB_PASSWORD: 'secret',
  REDIS_URL: 'redis://127.0.0.1:6379',
  SMTP_URL: 'smtp://127.0.0.1:25',
  S3_ENDPOINT: 'http://127.0.0.1:9000',
  S3_ACCESS_KEY_ID: 'key',
  S3_SECRET_ACCESS_KEY: 'secret',
};

function problemsOf(env: NodeJS.ProcessEnv): string[] {
  try {
    loadConfig(env);
  } catch (error) {
    if (error instanceof ConfigError) return error.problems;
    throw error;
  }
  throw new Error('loadConfig() accepted the environment');
}

describe('loadConfig', () => {
  it('loadConfig() refuses to start without JWT_SECRET outside demo mode, naming the variable', () => {
    const { JWT_SECRET: _secret, ...env } = production;
    expect(problemsOf(env)).toEqual(['JWT_SECRET: is required outside demo mode (LIMBUS_DEMO=1)']);
  });

  it('loadConfig() treats an empty JWT_SECRET as missing', () => {
    expect(problemsOf({ ...production, JWT_SECRET: '' })).toEqual([
      'JWT_SECRET: is required outside demo mode (LIMBUS_DEMO=1)',
    ]);
  });

  it('loadConfig() rejects a short JWT_SECRET', () => {
    expect(problemsOf({ ...production, JWT_SECRET: 'short' })).toEqual([
      'JWT_SECRET: must be at least 32 characters',
    ]);
  });

  it('loadConfig() lists every missing connection variable outside demo mode', () => {
    const { DB_PORT: _p, REDIS_URL: _r, S3_ENDPOINT: _s, ...env } = production;
    expect(problemsOf(env).sort()).toEqual([
      'DB_PORT: is required',
      'REDIS_URL: is required',
      'S3_ENDPOINT: is required',
    ]);
  });

  it('loadConfig() names a malformed variable and why', () => {
    const problems = problemsOf({ ...production, REDIS_URL: 'http://127.0.0.1:6379', DB_PORT: 'abc' });
    expect(problems).toHaveLength(2);
    expect(problems.find((p) => p.startsWith('REDIS_URL:'))).toBe(
      'REDIS_URL: must be a redis: or rediss: URL',
    );
    expect(problems.find((p) => p.startsWith('DB_PORT:'))).toMatch(/^DB_PORT: .*number/);
  });

  it('loadConfig() requires the initial admin outside demo mode', () => {
    const { LIMBUS_ADMIN_EMAIL: _e, LIMBUS_ADMIN_PASSWORD: _p, ...env } = production;
    expect(problemsOf(env).sort()).toEqual([
      'LIMBUS_ADMIN_EMAIL: is required outside demo mode (LIMBUS_DEMO=1)',
      'LIMBUS_ADMIN_PASSWORD: is required outside demo mode (LIMBUS_DEMO=1)',
    ]);
  });

  it('loadConfig() applies the documented defaults and keeps the given secret', () => {
    const config = loadConfig(production);
    expect(config.demo).toBe(false);
    expect(config.jwtSecret).toBe(production.JWT_SECRET);
    expect(config.port).toBe(8080);
    expect(config.publicUrl).toBe('http://127.0.0.1:8080');
    expect(config.accessTokenTtlSeconds).toBe(900);
    expect(config.mailFrom).toBe('Limbus <no-reply@limbus.invalid>');
    expect(config.s3.bucket).toBe('limbus');
    expect(config.s3.region).toBe('us-east-1');
    expect(config.db.host).toBe('127.0.0.1');
    expect(config.initialAdmin).toEqual({
      email: 'head@example.org',
      password: production.LIMBUS_ADMIN_PASSWORD,
    });
    expect(config.mailCatcherUrl).toBeNull();
  });

  it('loadConfig() in demo mode starts from nothing with a generated secret', () => {
    const a = loadConfig({ LIMBUS_DEMO: '1' });
    const b = loadConfig({ LIMBUS_DEMO: '1' });
    expect(a.demo).toBe(true);
    expect(a.jwtSecret.length).toBeGreaterThanOrEqual(32);
    expect(a.jwtSecret).not.toBe(b.jwtSecret);
    expect(a.db.port).toBe(33061);
    expect(a.redisUrl).toBe('redis://127.0.0.1:63791');
    expect(a.initialAdmin).toBeNull();
  });

  it('loadConfig() derives the public URL from the port and strips a trailing slash when given', () => {
    expect(loadConfig({ ...production, LIMBUS_PORT: '9090' }).publicUrl).toBe('http://127.0.0.1:9090');
    expect(loadConfig({ ...production, LIMBUS_PUBLIC_URL: 'https://limbus.example.org/' }).publicUrl).toBe(
      'https://limbus.example.org',
    );
  });
});
