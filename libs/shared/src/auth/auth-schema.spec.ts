import { describe, expect, it } from 'vitest';
import { newPasswordSchema, PASSWORD_MAX_BYTES, utf8ByteLength } from './auth-schema';

describe('newPasswordSchema', () => {
  it('accepts 72 plain letters, the most bcrypt reads', () => {
    expect(newPasswordSchema.safeParse('a'.repeat(72)).success).toBe(true);
  });

  it('refuses 40 accented letters: 40 characters but 80 bytes, past what bcrypt reads', () => {
    const password = 'é'.repeat(40);
    expect(password.length).toBe(40);
    const result = newPasswordSchema.safeParse(password);
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]!.message).toMatch(/at most 72 bytes/);
  });

  it('counts an emoji as four bytes, so 18 of them fit and 19 do not', () => {
    expect(newPasswordSchema.safeParse('🧼'.repeat(18)).success).toBe(true);
    expect(newPasswordSchema.safeParse('🧼'.repeat(19)).success).toBe(false);
  });
});

describe('utf8ByteLength', () => {
  it('agrees with the UTF-8 encoder on letters, accents, CJK, emoji and a lone surrogate', () => {
    for (const text of ['abc', 'é', '漢字', '🧼x', '\ud800', 'Ωmega €5']) {
      expect(utf8ByteLength(text)).toBe(new TextEncoder().encode(text).length);
    }
    expect(PASSWORD_MAX_BYTES).toBe(72); // bcrypt's input limit, from the algorithm's definition (from memory)
  });
});
