import bcrypt from 'bcryptjs';
import { COMMON_PASSWORDS } from './commonPasswords';

/** Production cost; tests may pass a lower one to stay fast (see tests/server/support). */
export const BCRYPT_COST = 12;

export function passwordProblem(password: string): string | undefined {
  if (password.length < 8) return 'Use at least 8 characters for your password.';
  if (COMMON_PASSWORDS.has(password.toLowerCase())) {
    return 'That password is one of the most common ones and easy to guess. Choose another.';
  }
  return undefined;
}

export const hashPassword = (password: string, cost: number = BCRYPT_COST) => bcrypt.hash(password, cost);

export const verifyPassword = (password: string, hash: string) => bcrypt.compare(password, hash);

let dummyHash: Promise<string> | undefined;
/** A hash to compare against when the account does not exist, so timing does not reveal it. */
export function dummyHashFor(cost: number): Promise<string> {
  dummyHash ??= bcrypt.hash('no account has this password', cost);
  return dummyHash;
}
