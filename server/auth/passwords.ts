import bcrypt from 'bcryptjs';
import { newPasswordSchema } from '../../src/contract/auth';
import { COMMON_PASSWORDS } from './commonPasswords';

/** Production cost; tests may pass a lower one to stay fast (see tests/server/support). */
export const BCRYPT_COST = 12;

/**
 * Why a new password cannot be used, or undefined. Besides the contract's rules (length, at most
 * 72 bytes, not one repeated character), the server refuses the most common passwords and the
 * account's own address.
 */
export function passwordProblem(password: string, email: string): string | undefined {
  const shape = newPasswordSchema.safeParse(password);
  if (!shape.success) return shape.error.issues[0]!.message;
  const lower = password.trim().toLowerCase();
  if (COMMON_PASSWORDS.has(lower)) {
    return 'That password is one of the most common ones and easy to guess. Choose another.';
  }
  const address = email.trim().toLowerCase();
  if (lower === address || lower === address.split('@')[0]) {
    return 'Your password cannot be your e-mail address. Choose something only you know.';
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
