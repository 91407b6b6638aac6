import type { Transaction } from 'sequelize';
import { User } from '../models';
import { hashPassword } from '../../auth/passwords';
import type { Role } from '../../../shared/schemas/auth';

/** The Harrow Sound demo accounts (invented). Created by the demo seed only, never in production. */
export const DEMO_PASSWORD = 'harrow-demo-2026';
export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@harrow.example', name: 'Morven Tait (admin)', role: 'admin' },
  { email: 'engineer@harrow.example', name: 'Idris Calloway', role: 'engineer' },
  { email: 'checker@harrow.example', name: 'Senna Holloway', role: 'checker' },
  { email: 'librarian@harrow.example', name: 'Tamsin Oyelaran', role: 'librarian' },
  { email: 'viewer@harrow.example', name: 'Pell Abernethy', role: 'viewer' },
];

export async function seedDemoUsers(transaction: Transaction): Promise<number> {
  let created = 0;
  const existing = await User.count({ where: { email: DEMO_USERS.map((u) => u.email) }, transaction });
  if (existing === DEMO_USERS.length) return 0;
  const hash = await hashPassword(DEMO_PASSWORD);
  for (const u of DEMO_USERS) {
    const [, isNew] = await User.findOrCreate({
      where: { email: u.email },
      defaults: { ...u, passwordHash: hash, lastLoginAt: null },
      transaction,
    });
    if (isNew) created++;
  }
  return created;
}
