import { describe, expect, it } from 'vitest';
import { readConfig } from './config';

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/nk', JWT_SECRET: 'x'.repeat(40), PAYMENT_WEBHOOK_SECRET: `whsec_${'k'.repeat(32)}` };

describe('settings that guard the installation', () => {
  it('refuses to start in production without a payment webhook secret, naming it; there is no built-in one', () => {
    const { PAYMENT_WEBHOOK_SECRET: _, ...withoutSecret } = base;
    expect(() => readConfig({ ...withoutSecret, NODE_ENV: 'production' })).toThrow(/PAYMENT_WEBHOOK_SECRET: is required/);
    expect(() => readConfig({ ...withoutSecret, NODE_ENV: 'development' })).toThrow(/PAYMENT_WEBHOOK_SECRET/);
    expect(() => readConfig({ ...base, PAYMENT_WEBHOOK_SECRET: 'whsec_short', NODE_ENV: 'production' })).toThrow(/at least 24 characters/);
    expect(readConfig({ ...base, NODE_ENV: 'production' }).PAYMENT_WEBHOOK_SECRET).toBe(base.PAYMENT_WEBHOOK_SECRET);
  });

  it('trusts no proxy unless told which (X-Forwarded-For would otherwise pick the caller’s address)', () => {
    expect(readConfig(base).TRUST_PROXY).toBe(false);
    expect(readConfig({ ...base, TRUST_PROXY: '1' }).TRUST_PROXY).toBe(1);
    expect(readConfig({ ...base, TRUST_PROXY: 'loopback, 10.0.0.0/8' }).TRUST_PROXY).toBe('loopback, 10.0.0.0/8');
  });
});
