import bcrypt from 'bcryptjs';
import { dictionary } from '@zxcvbn-ts/language-common';
import { passwordLengthProblem } from '#shared/auth/password-policy.ts';
import { config } from '../../config/runtime.ts';
import { unprocessable } from '../../lib/errors.ts';

/** ASVS 6.2.4: refuse the most common passwords (the top 3,000 of zxcvbn's ranked list). */
const COMMON_PASSWORDS = new Set(
  (dictionary['passwords-common'] as string[]).slice(0, 3000).map((p) => p.toLowerCase()),
);

/** Throws 422 naming what is wrong with a new password. */
export function assertAcceptablePassword(password: string, field = 'password'): void {
  const problem =
    passwordLengthProblem(password) ??
    (COMMON_PASSWORDS.has(password.toLowerCase())
      ? 'is one of the most common passwords; choose another'
      : null);
  if (problem) {
    throw unprocessable('weak_password', `${field} ${problem}.`, [{ field, message: problem }]);
  }
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, config().BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

let dummyHash: Promise<string> | null = null;
/**
 * A hash to compare against when the e-mail is unknown, so an unknown user and a wrong password
 * take the same time (ASVS 6.3.8).
 */
export function dummyPasswordHash(): Promise<string> {
  dummyHash ??= bcrypt.hash('no such user: timing equaliser', config().BCRYPT_COST);
  return dummyHash;
}
