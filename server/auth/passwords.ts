import bcrypt from 'bcryptjs';
import { env } from '../config/env';

export const hashPassword = (plain: string) => bcrypt.hash(plain, env().BCRYPT_ROUNDS);

// Compared against when the account does not exist, so a missing account costs the same time.
let dummyHash: string | undefined;

export async function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    dummyHash ??= await bcrypt.hash('not-a-real-password', env().BCRYPT_ROUNDS);
    await bcrypt.compare(plain, dummyHash);
    return false;
  }
  return bcrypt.compare(plain, hash);
}
