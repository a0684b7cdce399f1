import { describe, expect, it } from 'vitest';
import { assertPasswordRule, judgePassword } from './password-rule';

describe('password rule', () => {
  it('When a password is shorter than 10 characters, then it is refused for its length', async () => {
    expect(await judgePassword('Kx7#pQ2v!')).toMatchObject({
      ok: false,
      problem: 'Use at least 10 characters',
    });
  });

  it('When a password is longer than 64 characters, then it is refused, and 64 is allowed', async () => {
    const words = 'copper manifold ridge lantern orchard '.repeat(3);
    expect((await judgePassword(words.slice(0, 65))).problem).toBe('Use at most 64 characters');
    expect((await judgePassword(words.slice(0, 64))).ok).toBe(true);
  });

  // Each of these is on, or a small variation of, zxcvbn's common-password list
  // (@zxcvbn-ts/language-common `passwords-common`) or a keyboard/repeat pattern it knows.
  it.each(['password1234', 'Password123!', 'qwertyuiop12', '1234567890', 'iloveyou12345', 'aaaaaaaaaaaa'])(
    'When the password is the common "%s", then it is refused with the reason',
    async (password) => {
      const verdict = await judgePassword(password);
      expect(verdict.ok).toBe(false);
      expect(verdict.score).toBeLessThan(3);
      expect(verdict.problem).toMatch(/^This password is too easy to guess\. \S/);
    },
  );

  it("When the password is the person's own e-mail, then it is refused though it passes for anyone else", async () => {
    expect((await judgePassword('zebulroktvanmire')).ok).toBe(true);
    const verdict = await judgePassword('zebulroktvanmire', ['zebulrokt.vanmire@test.example']);
    expect(verdict.ok).toBe(false);
    expect(verdict.problem).toContain('personal');
  });

  // "correct horse battery staple": the four-random-words example zxcvbn was written around (from memory).
  it.each(['correct horse battery staple', 'Blue-kettle-ridge-42', 'Furnace-orifice-71'])(
    'When the password is "%s" (unrelated words), then it passes',
    async (password) => {
      expect(await judgePassword(password)).toMatchObject({ ok: true, problem: null });
    },
  );

  it('When the rule is broken, then a 400 names the field that was checked', async () => {
    await expect(assertPasswordRule('password1234', 'next')).rejects.toThrowError(
      expect.objectContaining({
        status: 400,
        code: 'validation_failed',
        fields: { next: expect.any(String) },
      }),
    );
  });
});
