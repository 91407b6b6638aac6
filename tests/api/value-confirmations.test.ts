// Confirming a value of a published set is a reviewed step: proposed by one librarian, approved
// or rejected by another; approval marks the value confirmed on the set, and the audit log says so.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { createAccount, draftBody, materialId, signInAs } from '../helpers/library';
import { AuditEntry, PropertySet } from '../../server/db/models';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let librarian: Agent;
let second: Agent;
let engineer: Agent;

beforeAll(async () => {
  handle = await startTestApp();
  await createAccount('confirm.reviewer@harrow.example', 'Lowena Hosking', 'librarian');
  librarian = await signIn(handle.app, 'librarian');
  second = await signInAs(handle.app, 'confirm.reviewer@harrow.example');
  engineer = await signIn(handle.app, 'engineer');
});
afterAll(async () => {
  await handle.stop();
});

/** A published set (the `skip`-th such) holding `key` with a status other than confirmed. */
async function setWithUnconfirmed(key: string, skip = 0): Promise<number> {
  const rows = await PropertySet.findAll({ where: { status: 'published' }, order: [['id', 'ASC']] });
  const open = rows.filter((r) => {
    const row = r.get({ plain: true }) as Record<string, unknown> & { provenance?: Record<string, { status?: string }> | null };
    return row[key] != null && row.provenance?.[key]?.status !== 'confirmed';
  });
  if (open.length <= skip) throw new Error(`the seed has fewer than ${skip + 1} published sets with ${key} unconfirmed`);
  return open[skip].id;
}

describe('value confirmations', () => {
  it('refuses the proposer approving their own confirmation (403 own_work); another librarian approves it and the value reads confirmed', async () => {
    const id = await setWithUnconfirmed('poissonsRatio');
    const before = (await engineer.get(`/api/property-sets/${id}`)).body;
    const proposed = await librarian.post(`/api/library/sets/${id}/confirmations`).send({ key: 'poissonsRatio', location: 'Table 2, row 4 (Poisson’s ratio 0.35)' });
    expect(proposed.status, JSON.stringify(proposed.body)).toBe(201);
    expect(proposed.body).toMatchObject({ status: 'proposed', key: 'poissonsRatio', proposedBy: { name: 'Tamsin Oyelaran' } });

    const own = await librarian.post(`/api/library/confirmations/${proposed.body.id}/steps`).send({ step: 'approve', lockVersion: proposed.body.lockVersion });
    expect(own.status).toBe(403);
    expect(own.body.error.code).toBe('own_work');
    expect((await engineer.get(`/api/property-sets/${id}`)).body.provenance?.poissonsRatio?.status ?? 'recalled').not.toBe('confirmed');

    const ok = await second.post(`/api/library/confirmations/${proposed.body.id}/steps`).send({ step: 'approve', lockVersion: proposed.body.lockVersion });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body).toMatchObject({ status: 'approved', decidedBy: { name: 'Lowena Hosking' } });
    const after = (await engineer.get(`/api/property-sets/${id}`)).body;
    expect(after.provenance.poissonsRatio).toMatchObject({ status: 'confirmed', location: 'Table 2, row 4 (Poisson’s ratio 0.35)', confirmedBy: { name: 'Tamsin Oyelaran' }, approvedBy: { name: 'Lowena Hosking' } });
    // The value itself and the set's version do not change: only what is known about it.
    expect([after.poissonsRatio, after.version]).toEqual([before.poissonsRatio, before.version]);
    const audit = await AuditEntry.findAll({ where: { entityType: 'property-set', entityId: String(id), action: 'confirm-value' } });
    expect(audit).toHaveLength(1);
    // The administrator's audit log filters by the confirmation itself: its proposal and its approval.
    const admin = await signIn(handle.app, 'admin');
    const log = await admin.get(`/api/admin/audit?entityType=value-confirmation&entityId=${proposed.body.id}`);
    expect(log.status, JSON.stringify(log.body)).toBe(200);
    expect(log.body.items.map((e: { action: string; actor: { name: string } }) => [e.action, e.actor.name])).toEqual([
      ['approve', 'Lowena Hosking'],
      ['propose', 'Tamsin Oyelaran'],
    ]);
    // A decided confirmation takes no more steps.
    const again = await second.post(`/api/library/confirmations/${proposed.body.id}/steps`).send({ step: 'reject', lockVersion: ok.body.lockVersion, comment: 'Changed my mind.' });
    expect(again.status).toBe(409);
  });

  it('rejects with a comment and leaves the value as it was; one open proposal per value', async () => {
    const id = await setWithUnconfirmed('density', 1);
    const p = await librarian.post(`/api/library/sets/${id}/confirmations`).send({ key: 'density', location: 'p. 7' });
    expect(p.status).toBe(201);
    const dup = await librarian.post(`/api/library/sets/${id}/confirmations`).send({ key: 'density', location: 'p. 8' });
    expect(dup.status).toBe(409);
    const noComment = await second.post(`/api/library/confirmations/${p.body.id}/steps`).send({ step: 'reject', lockVersion: p.body.lockVersion });
    expect(noComment.status).toBe(400);
    const rej = await second.post(`/api/library/confirmations/${p.body.id}/steps`).send({ step: 'reject', lockVersion: p.body.lockVersion, comment: 'Page 7 gives the bulk density of the resin, not the sheet.' });
    expect(rej.status).toBe(200);
    expect(rej.body.status).toBe('rejected');
    expect((await engineer.get(`/api/property-sets/${id}`)).body.provenance?.density?.status ?? 'recalled').not.toBe('confirmed');
    const queue = await second.get('/api/library/confirmations?status=proposed');
    expect(queue.body.items.map((c: { id: number }) => c.id)).not.toContain(p.body.id);
  });

  it('refuses a value the set does not have, a missing location, and a draft (400, 400, 409)', async () => {
    const id = await setWithUnconfirmed('density', 2);
    expect((await librarian.post(`/api/library/sets/${id}/confirmations`).send({ key: 'notAValue', location: 'p. 1' })).status).toBe(400);
    expect((await librarian.post(`/api/library/sets/${id}/confirmations`).send({ key: 'density' })).status).toBe(400);
    const material = await materialId(librarian, 'Cast acrylic (PMMA)');
    const draft = await librarian.post('/api/library/sets').send(draftBody(material));
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    expect((await librarian.post(`/api/library/sets/${draft.body.id}/confirmations`).send({ key: 'density', location: 'p. 1' })).status).toBe(409);
  });

  it('closes the proposals still waiting on a set that is retired or superseded, with the reason, audited', async () => {
    const lock = async (id: number) => (await second.get(`/api/library/sets/${id}`)).body.lockVersion as number;
    // Retired with a reason.
    const retiredId = await setWithUnconfirmed('density', 3);
    const p1 = await librarian.post(`/api/library/sets/${retiredId}/confirmations`).send({ key: 'density', location: 'Table 1, row 2' });
    expect(p1.status).toBe(201);
    const retired = await second.post(`/api/library/sets/${retiredId}/retire`).send({ lockVersion: await lock(retiredId), reason: 'Replaced by the lot-certified set.' });
    expect(retired.status, JSON.stringify(retired.body)).toBe(200);
    const closed = (await second.get(`/api/library/confirmations?propertySetId=${retiredId}`)).body.items.find((c: { id: number }) => c.id === p1.body.id);
    expect(closed).toMatchObject({ status: 'rejected', decidedBy: { name: 'Lowena Hosking' } });
    expect(closed.comment).toMatch(/^Closed without a decision: the property set was retired \(Replaced by the lot-certified set\.\)/);
    expect(await AuditEntry.count({ where: { entityType: 'value-confirmation', entityId: String(p1.body.id), action: 'close' } })).toBe(1);

    // Superseded: a revision approved by another librarian retires the old version and closes its proposals.
    const oldId = await setWithUnconfirmed('density', 3);
    const p2 = await librarian.post(`/api/library/sets/${oldId}/confirmations`).send({ key: 'density', location: 'Table 1, row 3' });
    expect(p2.status).toBe(201);
    const draft = await librarian.post(`/api/library/sets/${oldId}/revise`).send({ lockVersion: await lock(oldId) });
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    expect((await librarian.post(`/api/library/sets/${draft.body.id}/submit`).send({ lockVersion: draft.body.lockVersion })).status).toBe(200);
    const approved = await second.post(`/api/library/sets/${draft.body.id}/approve`).send({ lockVersion: await lock(draft.body.id) });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    const superseded = (await second.get(`/api/library/confirmations?propertySetId=${oldId}`)).body.items.find((c: { id: number }) => c.id === p2.body.id);
    expect(superseded.status).toBe('rejected');
    expect(superseded.comment).toContain(`the property set was superseded by version ${approved.body.version}`);
    // Nothing waits any more on a set that cannot be decided.
    const queue = (await second.get('/api/library/confirmations?status=proposed')).body.items.map((c: { propertySetId: number }) => c.propertySetId);
    expect(queue).not.toContain(retiredId);
    expect(queue).not.toContain(oldId);
  });
});
