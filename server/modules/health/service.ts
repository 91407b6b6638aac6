import { sequelize } from '../../db/sequelize';

/** True when the database answers one round trip. */
export async function databaseAnswers(): Promise<boolean> {
  try {
    await sequelize().query('SELECT 1', { plain: true, raw: true });
    return true;
  } catch {
    return false;
  }
}
