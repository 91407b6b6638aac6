import request from 'supertest';
import { createApp, type AppHandle } from '../../server/app';
import { resetDatabase } from '../../server/db/setup';
import { closeDatabase } from '../../server/db/sequelize';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import type { Role } from '../../shared/schemas/auth';

export type Agent = ReturnType<typeof request.agent>;

/** A fresh, seeded test database and an app bound to it, for one test file; `demoProject` adds the Harrow Sound demo projects. */
export async function startTestApp(options: { demoProject?: boolean } = {}): Promise<AppHandle & { stop(): Promise<void> }> {
  await resetDatabase(options);
  const handle = createApp();
  await handle.ready;
  return {
    ...handle,
    stop: async () => {
      await handle.close();
      await closeDatabase();
    },
  };
}

export const demoEmail = (role: Role) => `${role}@harrow.example`;

/** A supertest agent holding the session cookie of the demo account for a role. */
export async function signIn(app: AppHandle['app'], role: Role): Promise<Agent> {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/login').send({ email: demoEmail(role), password: DEMO_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}
