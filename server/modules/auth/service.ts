import { User } from '../../db/models';

/** Notes on the account when it last signed in (shown on the team page). */
export async function recordSignIn(userId: number): Promise<void> {
  await User.update({ lastLoginAt: new Date() }, { where: { id: userId } });
}
