import { describe, expect, it } from 'vitest';
import { loadEnv } from './env';

const required = {
  DATABASE_URL: 'postgres://batchproof@127.0.0.1:54329/batchproof',
  JWT_SECRET: 'a-secret-that-is-at-least-32-characters-long',
};

describe('loadEnv: DATABASE_POOL_SIZE', () => {
  it('keeps 20 connections unless told otherwise, enough for 20 concurrent clients', () => {
    expect(loadEnv(required).DATABASE_POOL_SIZE).toBe(20);
  });

  it('takes the pool size from the environment', () => {
    expect(loadEnv({ ...required, DATABASE_POOL_SIZE: '40' }).DATABASE_POOL_SIZE).toBe(40);
  });

  it('refuses a pool of no connections or not a whole number, naming the variable', () => {
    expect(() => loadEnv({ ...required, DATABASE_POOL_SIZE: '0' })).toThrow(/DATABASE_POOL_SIZE/);
    expect(() => loadEnv({ ...required, DATABASE_POOL_SIZE: 'many' })).toThrow(
      /DATABASE_POOL_SIZE/,
    );
  });
});
