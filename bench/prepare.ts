/**
 * Prepares the benchmark database (isobath_bench): migrate, empty it, seed the real catalogue,
 * then add synthetic published variants until it holds CATALOGUE_SIZE sets, plus one engineer
 * account. Synthetic sets are derived from the seed (values scaled a few percent) and exist only
 * in this database.
 */
import { emptyDatabase, setupDatabase } from '../server/db/setup';
import { sequelize, closeDatabase } from '../server/db/sequelize';
import { PropertySet, User } from '../server/db/models';
import { hashPassword } from '../server/auth/passwords';

export const CATALOGUE_SIZE = 2000;
export const BENCH_USER = { email: 'bench.engineer@harrow.example', password: 'harrow-bench-2026', name: 'Bench Engineer' };

export async function prepareBenchDatabase(): Promise<number> {
  await emptyDatabase();
  await setupDatabase({ demo: false });
  const seeds = await PropertySet.findAll({ where: { status: 'published' } });
  const rows = [];
  for (let i = seeds.length; i < CATALOGUE_SIZE; i++) {
    const s = seeds[i % seeds.length].get({ plain: true });
    const k = 0.9 + ((i * 7919) % 200) / 1000; // 0.90 … 1.10, deterministic
    rows.push({
      ...s,
      id: undefined,
      lineageId: null,
      condition: `${s.condition} — synthetic benchmark variant ${i}`,
      tensileStrength: s.tensileStrength * k,
      compressiveStrength: s.compressiveStrength * k,
      shearStrength: s.shearStrength * k,
      youngsModulus: s.youngsModulus * (2 - k),
      createdAt: new Date(),
      updatedAt: new Date(),
    });
  }
  await PropertySet.bulkCreate(rows as never[]);
  await sequelize().query('UPDATE property_sets SET lineage_id = id WHERE lineage_id IS NULL');
  await User.create({ email: BENCH_USER.email, name: BENCH_USER.name, role: 'engineer', passwordHash: await hashPassword(BENCH_USER.password), lastLoginAt: null });
  await sequelize().query('ANALYZE');
  return PropertySet.count({ where: { status: 'published' } });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  prepareBenchDatabase()
    .then((n) => console.log(`[bench] catalogue ready: ${n} published property sets`))
    .finally(() => closeDatabase());
}
