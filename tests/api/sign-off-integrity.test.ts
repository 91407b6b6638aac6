// What is signed is what was checked. Reproduces two findings of the sign-off assessment:
// (1) a load case edited after its shortlist was submitted changed the checked record's numbers;
// (2) a return round vanished from the shortlist and the record after the resubmission.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { User } from '../../server/db/models';
import { pdfText } from '../helpers/pdf-text';
import type { PropertySetDto } from '../../shared/schemas/catalogue';
import type { DesignRecordDto, ShortlistDto } from '../../shared/schemas/projects';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let engineer: Agent;
let checker: Agent;
let acrylic: PropertySetDto[];

beforeAll(async () => {
  handle = await startTestApp();
  engineer = await signIn(handle.app, 'engineer');
  checker = await signIn(handle.app, 'checker');
  acrylic = (await engineer.get('/api/property-sets?family=acrylic')).body.items;
});
afterAll(async () => {
  await handle.stop();
});

// Harrow Sound's survey vehicle forward port: a conical window at 1,200 m.
const deepPort = {
  pressure: { depth: 1200, latitude: 50, water: 'sea' },
  temperature: { min: 2, max: 25 },
  sustainedHours: 1000,
  cycles: 1000,
  component: { type: 'conical-frustum', minorDiameter: 0.1, thickness: 0.08, includedAngle: 90 },
};

async function submittedShortlist(): Promise<{ sl: ShortlistDto; loadCaseId: number }> {
  const project = await engineer.post('/api/projects').send({ name: 'Survey vehicle ports', description: 'Harrow Sound survey vehicle' });
  const checkerId = (await User.findOne({ where: { email: 'checker@harrow.example' } }))!.id;
  await engineer.post(`/api/projects/${project.body.id}/members`).send({ userId: checkerId }).expect(200);
  const lc = await engineer.post(`/api/projects/${project.body.id}/load-cases`).send({ name: 'Forward port, 1,200 m', loadCase: deepPort });
  expect(lc.status, JSON.stringify(lc.body)).toBe(201);
  const sl = await engineer.post(`/api/projects/${project.body.id}/shortlists`).send({ loadCaseId: lc.body.id, name: 'Forward port material' });
  const item = await engineer.post(`/api/shortlists/${sl.body.id}/items`).send({ propertySetId: acrylic[0].id, note: 'Standard minimums' });
  const submitted = await engineer.post(`/api/shortlists/${sl.body.id}/submit`).send({ lockVersion: item.body.lockVersion });
  expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
  return { sl: submitted.body as ShortlistDto, loadCaseId: lc.body.id };
}

describe('a submitted shortlist freezes its inputs', () => {
  it('refuses a check made on a read from before the load case was edited, and records what was submitted', async () => {
    const { sl, loadCaseId } = await submittedShortlist();
    // The checker reads it: these are the numbers they review.
    const read = (await checker.get(`/api/shortlists/${sl.id}`)).body as ShortlistDto;
    expect(read.frozenInputs).toBe(true);
    const reviewed = read.items[0].result!;
    expect(read.loadCase.loadCase.pressure).toMatchObject({ depth: 1200 });

    // The author edits the load case meanwhile: allowed (for a new submission), but it moves the shortlist on.
    const lc = (await engineer.get(`/api/load-cases/${loadCaseId}`)).body;
    const edit = await engineer.put(`/api/load-cases/${loadCaseId}`).send({ name: lc.name, loadCase: { ...deepPort, pressure: { depth: 50, latitude: 50, water: 'sea' } }, notes: '', lockVersion: lc.lockVersion });
    expect(edit.status, JSON.stringify(edit.body)).toBe(200);

    const stale = await checker.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: read.lockVersion });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale');

    // Read again: still the submitted load case and the same results.
    const again = (await checker.get(`/api/shortlists/${sl.id}`)).body as ShortlistDto;
    expect(again.loadCase.loadCase.pressure).toMatchObject({ depth: 1200 });
    expect(again.items[0].result!.safetyFactor).toBe(reviewed.safetyFactor);
    const checked = await checker.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: again.lockVersion, comment: 'Agreed at 1,200 m.' });
    expect(checked.status, JSON.stringify(checked.body)).toBe(200);

    const record = (await checker.get(`/api/records/${checked.body.designRecordId}`)).body as DesignRecordDto;
    expect(record.content.loadCase.input.pressure).toMatchObject({ depth: 1200 });
    expect(record.content.candidates[0].result.safetyFactor).toBe(reviewed.safetyFactor);
    expect(record.content.candidates[0].result.requiredThickness).toBe(reviewed.requiredThickness);
    // The edited load case is what a new shortlist would use.
    expect((await engineer.get(`/api/load-cases/${loadCaseId}`)).body.loadCase.pressure).toMatchObject({ depth: 50 });
    // The administrator's audit log filters by load case: its creation and the edit.
    const admin = await signIn(handle.app, 'admin');
    const log = await admin.get(`/api/admin/audit?entityType=load-case&entityId=${loadCaseId}`);
    expect(log.status, JSON.stringify(log.body)).toBe(200);
    expect(log.body.items.map((e: { action: string }) => e.action)).toEqual(['update', 'create']);
  });

  it('keeps every round: the return with its comment, what changed, and the check, on the shortlist and in the record', async () => {
    const { sl } = await submittedShortlist();
    const returned = await checker.post(`/api/shortlists/${sl.id}/return`).send({ lockVersion: sl.lockVersion, comment: 'Add a fallback candidate.' });
    expect(returned.status).toBe(200);
    expect(returned.body.frozenInputs).toBe(false);
    const added = await engineer.post(`/api/shortlists/${sl.id}/items`).send({ propertySetId: acrylic[1].id, note: 'Fallback' });
    const again = await engineer.post(`/api/shortlists/${sl.id}/submit`).send({ lockVersion: added.body.lockVersion });
    const checked = await checker.post(`/api/shortlists/${sl.id}/check`).send({ lockVersion: again.body.lockVersion });
    expect(checked.status).toBe(200);

    const rounds = (checked.body as ShortlistDto).rounds;
    expect(rounds.map((r) => [r.round, r.outcome, r.comment])).toEqual([
      [1, 'returned', 'Add a fallback candidate.'],
      [2, 'checked', null],
    ]);
    expect(rounds[0].decidedBy?.name).toBe(rounds[1].decidedBy?.name);
    expect(rounds[0].changes).toEqual([]);
    expect(rounds[1].changes).toEqual([`Added ${acrylic[1].material.name} — ${acrylic[1].condition} (version ${acrylic[1].version}).`]);
    expect(rounds[1].candidates.map((c) => c.propertySetId)).toEqual([acrylic[0].id, acrylic[1].id]);

    const record = (await checker.get(`/api/records/${checked.body.designRecordId}`)).body as DesignRecordDto;
    expect(record.content.formatVersion).toBe(2);
    expect(record.content.rounds).toEqual(rounds);

    // …and in its PDF.
    const pdf = await engineer.get(`/api/records/${checked.body.designRecordId}/pdf`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    const { text } = await pdfText(pdf.body as Buffer);
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain('Rounds of checking');
    expect(flat).toContain('Round 1: submitted by');
    expect(flat).toContain('“Add a fallback candidate.”');
    expect(flat).toContain(`Added ${acrylic[1].material.name}`);
  });
});
