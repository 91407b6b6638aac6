import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { resetDatabase, setupDatabase } from '../../server/db/setup';
import { createApp } from '../../server/app';
import { closeDatabase } from '../../server/db/sequelize';
import { signIn } from '../helpers/app';
import { Project } from '../../server/db/models/projects';

let handle: ReturnType<typeof createApp>;
beforeAll(async () => {
  await resetDatabase({ demoProject: true });
  handle = createApp();
});
afterAll(async () => {
  await handle.close();
  await closeDatabase();
});

describe('the Harrow Sound demo seed', () => {
  it('creates the submersible project with saved load cases, an open shortlist and a checked one with its record', async () => {
    const engineer = await signIn(handle.app, 'engineer');
    const projects = (await engineer.get('/api/projects')).body.items as { id: number; name: string }[];
    const sub = projects.find((p) => p.name.startsWith('HS-2'));
    expect(sub).toBeTruthy();
    const loadCases = (await engineer.get(`/api/projects/${sub!.id}/load-cases`)).body.items;
    expect(loadCases.length).toBeGreaterThanOrEqual(2);
    const shortlists = (await engineer.get(`/api/projects/${sub!.id}/shortlists`)).body.items as { status: string; designRecordId: number | null }[];
    expect(shortlists.map((s) => s.status).sort()).toEqual(['checked', 'open']);
    const checked = shortlists.find((s) => s.status === 'checked')!;
    const record = await engineer.get(`/api/records/${checked.designRecordId}`);
    expect(record.status).toBe(200);
    expect(record.body.content.checker.email).toBe('checker@harrow.example');
    expect(record.body.content.candidates.length).toBe(2);
    // The viewer is a member and can read it; nothing but invented names appear.
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.get(`/api/records/${checked.designRecordId}`)).status).toBe(200);
  });

  it('does not seed the projects twice', async () => {
    const before = await Project.count();
    const again = await setupDatabase({ demo: true });
    expect(again.demoProject).toBe(false);
    expect(await Project.count()).toBe(before);
  });
});
