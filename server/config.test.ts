import { describe, expect, it } from 'vitest';
import { paymentMode, readConfig } from './config';

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

  it('reads test or live mode from the payment keys, which must agree; no keys at all is the local test mode', () => {
    expect(paymentMode(readConfig(base))).toBe('test');
    expect(readConfig(base).PAYMENT_PUBLISHABLE_KEY).toMatch(/^pk_test_/);
    expect(paymentMode(readConfig({ ...base, PAYMENT_API_KEY: 'sk_live_abc123', PAYMENT_PUBLISHABLE_KEY: 'pk_live_abc123' }))).toBe('live');
    expect(() => readConfig({ ...base, PAYMENT_API_KEY: 'sk_live_abc123' })).toThrow(/PAYMENT_PUBLISHABLE_KEY: the secret and publishable keys/);
    expect(() => readConfig({ ...base, PAYMENT_API_KEY: 'pk_test_abc' })).toThrow(/PAYMENT_API_KEY: must be a secret key/);
  });
});
