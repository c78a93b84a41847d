import { ZxcvbnFactory } from '@zxcvbn-ts/core';
import { adjacencyGraphs, dictionary } from '@zxcvbn-ts/language-common';

export const passwordMinLength = 12;
export const passwordMaxLength = 64;
/** bcrypt reads only the first 72 bytes: anything after them would not count. */
const bcryptMaxBytes = 72;

let checker: ZxcvbnFactory | null = null;

/**
 * Why a new password is refused, in words for the person choosing it, or null when it is fine.
 * Besides length, zxcvbn's estimate refuses common passwords, keyboard runs, dates and passwords
 * built from the person's own e-mail or name (score below 3 of 4).
 */
export function passwordProblem(password: string, personal: string[] = []): string | null {
  if (password.length < passwordMinLength) return `Use at least ${passwordMinLength} characters.`;
  if (password.length > passwordMaxLength) return `Use at most ${passwordMaxLength} characters.`;
  if (Buffer.byteLength(password, 'utf8') > bcryptMaxBytes)
    return 'This password is too long to store whole: use fewer accented letters or symbols.';
  checker ??= new ZxcvbnFactory({ dictionary: { ...dictionary }, graphs: adjacencyGraphs });
  const words = personal.flatMap((value) => value.toLowerCase().split(/[^\p{L}\p{N}]+/u)).filter((word) => word.length >= 3);
  if (checker.check(password, [...personal, ...words]).score < 3) {
    return 'This password is too easy to guess: it is common, follows a pattern or uses your name or e-mail. A few unrelated words make a strong one.';
  }
  return null;
}
