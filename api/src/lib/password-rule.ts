import type { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { AppError } from './errors';

/**
 * The one password rule of the product, checked on the server wherever a password is set
 * (change, reset, joining by invitation, admin-made sign-ins): 10 to 64 characters and not easy
 * to guess, i.e. zxcvbn's score of at least 3 with its common-password, common-word and English
 * dictionaries. The web app states the rule and shows this module's message; it never ships the
 * dictionaries.
 */
export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_LENGTH = 64;
export const PASSWORD_MIN_SCORE = 3;

/** The product's own name makes a password easier to guess here. */
const PRODUCT_WORDS = ['lightoff'];

// Loaded on first use: the dictionaries take about 0.1 s and some 40 MB of memory, which a server
// that nobody sets a password on (most of the time) should not carry.
let zxcvbn: Promise<ZxcvbnFactory> | undefined;
function estimator(): Promise<ZxcvbnFactory> {
  zxcvbn ??= Promise.all([
    import('@zxcvbn-ts/core'),
    import('@zxcvbn-ts/language-common'),
    import('@zxcvbn-ts/language-en'),
  ]).then(
    ([core, common, en]) =>
      new core.ZxcvbnFactory({
        dictionary: { ...common.dictionary, ...en.dictionary },
        graphs: common.adjacencyGraphs,
        translations: en.translations,
      }),
  );
  return zxcvbn;
}

/** The person's own details, split into the words a guesser would try first. */
function personalWords(inputs: readonly (string | null | undefined)[]): string[] {
  const words = new Set<string>(PRODUCT_WORDS);
  for (const input of inputs) {
    if (!input) continue;
    const text = input.toLowerCase();
    words.add(text);
    for (const part of text.split(/[^a-z0-9]+/)) if (part.length >= 3) words.add(part);
  }
  return [...words];
}

export interface PasswordVerdict {
  ok: boolean;
  /** Why not, in words for the person choosing it; null when it is fine. */
  problem: string | null;
  score: number;
}

/** Judges a password; `personal` are the person's e-mail, name, company (they make it guessable). */
export async function judgePassword(
  password: string,
  personal: readonly (string | null | undefined)[] = [],
): Promise<PasswordVerdict> {
  const length = [...password].length;
  if (length < PASSWORD_MIN_LENGTH) {
    return { ok: false, problem: `Use at least ${PASSWORD_MIN_LENGTH} characters`, score: 0 };
  }
  if (length > PASSWORD_MAX_LENGTH) {
    return { ok: false, problem: `Use at most ${PASSWORD_MAX_LENGTH} characters`, score: 0 };
  }
  const result = (await estimator()).check(password, personalWords(personal));
  if (result.score >= PASSWORD_MIN_SCORE) return { ok: true, problem: null, score: result.score };
  const advice = [result.feedback.warning, ...result.feedback.suggestions].filter(Boolean).join(' ');
  return {
    ok: false,
    problem: `This password is too easy to guess.${advice ? ` ${advice}` : ''}`,
    score: result.score,
  };
}

/** Throws a 400 naming `field` when the password breaks the rule. */
export async function assertPasswordRule(
  password: string,
  field: string,
  personal: readonly (string | null | undefined)[] = [],
): Promise<void> {
  const verdict = await judgePassword(password, personal);
  if (!verdict.ok) {
    throw AppError.validation({ [field]: verdict.problem! }, 'Choose a stronger password');
  }
}
