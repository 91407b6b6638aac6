// Fixtures for the library desk's API tests: extra accounts, a draft body, caught mail.
import request from 'supertest';
import { expect } from 'vitest';
import type { AppHandle } from '../../server/app';
import { User } from '../../server/db/models';
import { hashPassword } from '../../server/auth/passwords';
import { listCaughtMail, type CaughtMail } from '../../server/services/mail';
import type { Role } from '../../shared/schemas/auth';
import type { Agent } from './app';

export const EXTRA_PASSWORD = 'harrow-test-only-2026';

/** A further account for one test file (the demo seed keeps its five). */
export async function createAccount(email: string, name: string, role: Role): Promise<User> {
  return User.create({ email, name, role, passwordHash: await hashPassword(EXTRA_PASSWORD), lastLoginAt: null });
}

export async function signInAs(app: AppHandle['app'], email: string, password = EXTRA_PASSWORD): Promise<Agent> {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** A draft in the Harrow Sound scenario: a cast acrylic viewport sheet with its acceptance test. */
export function draftBody(materialId: number, overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    condition: 'Harrow Sound lot 12 cast sheet, 150 mm, annealed after machining',
    materialId,
    reference: {
      kind: 'test-report',
      title: 'Harrow Sound Marine Works acceptance tests, viewport sheet lot 12',
      authors: 'Harrow Sound Marine Works test laboratory',
      year: 2026,
      identifier: 'HSMW-TR-0112',
      location: 'Table 3',
    },
    density: 1190,
    youngsModulus: 3.1e9,
    poissonsRatio: 0.37,
    tensileStrength: 70e6,
    compressiveStrength: 110e6,
    compressiveYield: 105e6,
    shearStrength: 60e6,
    elongation: 0.03,
    luminousTransmittance: 0.91,
    serviceTemperature: { min: 10, max: 66 },
    valueDetails: { tensileStrength: { basis: 'minimum', testMethod: 'ASTM D638', temperature: 23 } },
    temperatureFactors: [
      { temperature: 10, factor: 1.1 },
      { temperature: 66, factor: 0.6 },
    ],
    ...overrides,
  };
}

/** Mail caught since `since` (ISO time) whose subject contains `subjectPart`. */
export async function caughtSince(since: string, subjectPart: string): Promise<CaughtMail[]> {
  const all = await listCaughtMail({ limit: 500 });
  return all.filter((m) => m.receivedAt >= since && m.subject.includes(subjectPart));
}

/** The id of a material by exact name, read through the API. */
export async function materialId(agent: Agent, name: string): Promise<number> {
  const res = await agent.get('/api/materials');
  expect(res.status).toBe(200);
  const found = (res.body.items as { id: number; name: string }[]).find((m) => m.name === name);
  if (!found) throw new Error(`no material named ${name}`);
  return found.id;
}
