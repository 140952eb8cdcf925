import { describe, expect, it } from 'vitest';
import { resetPasswordPayload } from '../schemas/users';
import { MAX_PASSWORD_BYTES, passwordBytes, passwordWeakness } from './password-strength';

// The kinds of password refused follow NIST SP 800-63B §5.1.1.2 (from memory): values from lists of commonly
// used or breached passwords, dictionary words, repetitive or sequential characters, and context-specific
// words such as the name of the service or of the person.
describe('guessable passwords are refused with a reason in plain words', () => {
  it.each([
    ['password1234', /commonly used password/],
    ['qwertyuiop123', /commonly used password/],
    ['aaaaaaaaaaaa', /Repeated characters/],
  ])('refuses %s (a common password or pattern)', async (password, reason) => {
    const weakness = await passwordWeakness(password);
    expect(weakness).toMatch(/^is too easy to guess\. /);
    expect(weakness).toMatch(reason);
  });

  it('refuses the name of the service, the firm and the person', async () => {
    expect(await passwordWeakness('nestkeeper2025')).toMatch(/name or address/);
    expect(await passwordWeakness('Brackenmoor2027', ['owner@demo.test', 'Maren Holloway', 'Brackenmoor Dimensional Works'])).toMatch(/name or address/);
    expect(await passwordWeakness('Wendel Ashgrove1', ['wendel@demo.test', 'Wendel Ashgrove'])).toMatch(/name or address/);
    // The same strings are accepted for someone else: it is the context that makes them guessable.
    expect(await passwordWeakness('Brackenmoor2027', ['someone@else.test'])).toBeNull();
    expect(await passwordWeakness('Wendel Ashgrove1', ['someone@else.test'])).toBeNull();
  });

  it('accepts a passphrase of unrelated words', async () => {
    expect(await passwordWeakness('kestrel-umber-vault-29', ['owner@demo.test', 'Maren Holloway', 'Brackenmoor Dimensional Works'])).toBeNull();
  });
});

describe("bcrypt's 72 bytes", () => {
  it('counts UTF-8 bytes, not characters', () => {
    // RFC 3629 §3: U+00FC (ü) takes two bytes, U+20AC (€) three.
    expect(passwordBytes('ü')).toBe(2);
    expect(passwordBytes('€')).toBe(3);
  });

  it('refuses a new password longer than 72 bytes, even when it has fewer characters', () => {
    expect(resetPasswordPayload.safeParse({ password: 'k'.repeat(MAX_PASSWORD_BYTES) }).success).toBe(true);
    expect(resetPasswordPayload.safeParse({ password: 'k'.repeat(MAX_PASSWORD_BYTES + 1) }).success).toBe(false);
    const euros = '€'.repeat(25); // 25 characters, 75 bytes
    const refused = resetPasswordPayload.safeParse({ password: euros });
    expect(refused.success).toBe(false);
    expect(refused.error?.issues[0].message).toMatch(/at most 72 bytes/);
  });
});
