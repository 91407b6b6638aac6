// The one step runner (server/workflows/run-step.ts), case by case on real PostgreSQL: each
// refusal of the workflow tables answers its status and code and changes nothing (no status
// change, no lock-version move, no audit entry); each allowed step moves the status, the lock
// version by one, and writes one audit entry in the same transaction.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, demoEmail } from '../helpers/app';
import { createAccount, draftBody } from '../helpers/library';
import { AuditEntry, Material, PropertySet, ReferenceVersion, User } from '../../server/db/models';
import { DesignRecord, Shortlist } from '../../server/db/models/projects';
import { AppError } from '../../server/errors';
import { createDraft, stepSet } from '../../server/modules/library/service';
import { createReference, updateReference } from '../../server/modules/references/service';
import { stepReferenceVersion } from '../../server/modules/references/versions';
import { addMember, createLoadCase, createProject } from '../../server/modules/projects/service';
import { addItem, createShortlist } from '../../server/modules/projects/shortlists';
import { stepShortlist } from '../../server/modules/projects/shortlist-steps';
import { draftInputSchema } from '../../shared/schemas/library';
import { loadCaseSaveSchema } from '../../shared/schemas/projects';
import type { CuratedStepName } from '../../shared/workflows/curated';
import type { ShortlistStepName } from '../../shared/workflows/shortlist';
import type { Role } from '../../shared/roles';

type Actor = { id: number; name: string; role: Role };
let handle: Awaited<ReturnType<typeof startTestApp>>;
const people: Record<'librarian' | 'second' | 'engineer' | 'otherEngineer' | 'checker' | 'authorChecker' | 'outsideChecker', Actor> = {} as never;
let acrylicId: number;
let publishedSetId: number;
let n = 0;
const unique = (s: string) => `${s} ${++n}`;

const actorOf = (u: User): Actor => ({ id: u.id, name: u.name, role: u.role });
const byEmail = async (email: string) => actorOf((await User.findOne({ where: { email } }))!);

beforeAll(async () => {
  handle = await startTestApp();
  people.librarian = await byEmail(demoEmail('librarian'));
  people.engineer = await byEmail(demoEmail('engineer'));
  people.checker = await byEmail(demoEmail('checker'));
  people.second = actorOf(await createAccount('runner.second@harrow.example', 'Morwen Tallack', 'librarian'));
  people.otherEngineer = actorOf(await createAccount('runner.engineer@harrow.example', 'Ivo Penhallow', 'engineer'));
  people.authorChecker = actorOf(await createAccount('runner.checker@harrow.example', 'Senara Quick', 'checker'));
  people.outsideChecker = actorOf(await createAccount('runner.outside@harrow.example', 'Jory Kitto', 'checker'));
  acrylicId = (await Material.findOne({ where: { name: 'Cast acrylic (PMMA)' } }))!.id;
  publishedSetId = (await PropertySet.findOne({ where: { materialId: acrylicId, status: 'published' } }))!.id;
});
afterAll(async () => {
  await handle.stop();
});

// ---- Property sets (the curated table) -------------------------------------------------------

type SetState = 'draft' | 'in-review' | 'in-review-uncited';

async function setIn(state: SetState): Promise<{ id: number; lockVersion: number }> {
  const body = draftBody(acrylicId, { condition: unique('Harrow Sound runner lot'), ...(state === 'in-review-uncited' ? { reference: undefined } : {}) });
  const draft = await createDraft(draftInputSchema.parse(body), people.librarian);
  if (state === 'draft') return draft;
  return stepSet(draft.id, 'submit', { lockVersion: draft.lockVersion }, people.librarian);
}

type Expect = { ok: true; status: string } | { ok: false; http: number; code: string; field?: string };

const SET_CASES: [string, SetState, CuratedStepName, keyof typeof people, { comment?: string; stale?: boolean }, Expect][] = [
  ['the author approves', 'in-review', 'approve', 'librarian', {}, { ok: false, http: 403, code: 'own_work' }],
  ['the author returns', 'in-review', 'return', 'librarian', { comment: 'Check the source.' }, { ok: false, http: 403, code: 'own_work' }],
  ['a draft is approved', 'draft', 'approve', 'second', {}, { ok: false, http: 409, code: 'wrong_status' }],
  ['an engineer approves', 'in-review', 'approve', 'engineer', {}, { ok: false, http: 403, code: 'forbidden' }],
  ['an approval from an older read', 'in-review', 'approve', 'second', { stale: true }, { ok: false, http: 409, code: 'stale' }],
  ['a return without a comment', 'in-review', 'return', 'second', { comment: '  ' }, { ok: false, http: 400, code: 'invalid_input', field: 'comment' }],
  ['a set citing nothing is approved', 'in-review-uncited', 'approve', 'second', {}, { ok: false, http: 400, code: 'invalid_input', field: 'referenceId' }],
  ['a second librarian approves', 'in-review', 'approve', 'second', {}, { ok: true, status: 'published' }],
  ['a second librarian returns', 'in-review', 'return', 'second', { comment: 'Cite the table page.' }, { ok: true, status: 'draft' }],
  ['the author submits', 'draft', 'submit', 'librarian', {}, { ok: true, status: 'in-review' }],
];

async function auditCount(entityType: string, id: number) {
  return AuditEntry.count({ where: { entityType, entityId: String(id) } });
}

async function expectOutcome(run: () => Promise<unknown>, expected: Expect) {
  if (expected.ok) return run();
  const err = await run().then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  const e = err as AppError;
  expect([e.status, e.code]).toEqual([expected.http, expected.code]);
  if (expected.field) expect(Object.keys(e.fields ?? {})).toContain(expected.field);
  return null;
}

describe('runStep on property sets', () => {
  it.each(SET_CASES)('%s', async (_label, state, step, who, input, expected) => {
    const set = await setIn(state);
    const before = (await PropertySet.findByPk(set.id))!;
    const audits = await auditCount('property-set', set.id);
    await expectOutcome(() => stepSet(set.id, step, { lockVersion: input.stale ? set.lockVersion - 1 : set.lockVersion, comment: input.comment }, people[who]), expected);
    const after = (await PropertySet.findByPk(set.id))!;
    if (expected.ok) {
      expect(after.status).toBe(expected.status);
      expect(after.lockVersion).toBe(before.lockVersion + 1);
      const entries = await AuditEntry.findAll({ where: { entityType: 'property-set', entityId: String(set.id) }, order: [['id', 'DESC']] });
      expect(entries).toHaveLength(audits + 1);
      expect(entries[0].action).toBe(step);
      expect(entries[0].actorId).toBe(people[who].id);
      if (input.comment) expect(entries[0].after).toMatchObject({ comment: input.comment });
    } else {
      expect([after.status, after.lockVersion]).toEqual([before.status, before.lockVersion]);
      expect(await auditCount('property-set', set.id)).toBe(audits);
    }
  });

  it('says the stale words of the kind of record', async () => {
    const set = await setIn('in-review');
    await expect(stepSet(set.id, 'approve', { lockVersion: set.lockVersion + 5 }, people.second)).rejects.toMatchObject({
      message: 'Someone saved this set after you opened it. Reload to see their changes; your edits are still in the form.',
    });
  });

  it('leaves the caller on the new draft after a revision, and refuses a second revision of the same lineage', async () => {
    const published = (await PropertySet.findByPk(publishedSetId))!;
    const draft = await stepSet(published.id, 'revise', { lockVersion: published.lockVersion }, people.librarian);
    expect(draft).toMatchObject({ status: 'draft', supersedesId: published.id });
    const again = (await PropertySet.findByPk(publishedSetId))!;
    await expect(stepSet(again.id, 'revise', { lockVersion: again.lockVersion }, people.second)).rejects.toMatchObject({ status: 409, code: 'revision_open' });
  });
});

// ---- Reference changes (the curated table without revise and retire) ------------------------

type ChangeState = 'draft' | 'in-review';

/** A reference cited by a published set, and a proposed change to it (version 2) in `state`. */
async function changeIn(state: ChangeState): Promise<{ referenceId: number; id: number; lockVersion: number }> {
  const citation = { kind: 'test-report' as const, title: unique('Harrow Sound runner report'), year: 2026 };
  const ref = await createReference(citation, people.librarian);
  const draft = await createDraft(draftInputSchema.parse(draftBody(acrylicId, { condition: unique('Harrow Sound runner lot'), reference: undefined, referenceId: ref.id })), people.librarian);
  const inReview = await stepSet(draft.id, 'submit', { lockVersion: draft.lockVersion }, people.librarian);
  await stepSet(draft.id, 'approve', { lockVersion: inReview.lockVersion }, people.second);
  const { reference } = await updateReference(ref.id, ref.lockVersion, { ...citation, location: 'Table 9' }, people.librarian);
  let row = reference.pending!;
  if (state === 'in-review') {
    await stepReferenceVersion(ref.id, 2, { step: 'submit', lockVersion: row.lockVersion }, people.librarian);
    row = { ...row, lockVersion: (await ReferenceVersion.findByPk(row.id))!.lockVersion };
  }
  return { referenceId: ref.id, id: row.id, lockVersion: row.lockVersion };
}

const CHANGE_CASES: [string, ChangeState, 'submit' | 'approve' | 'return', keyof typeof people, { comment?: string; stale?: boolean }, Expect][] = [
  ['its author approves it', 'in-review', 'approve', 'librarian', {}, { ok: false, http: 403, code: 'own_work' }],
  ['its author returns it', 'in-review', 'return', 'librarian', { comment: 'Check the table.' }, { ok: false, http: 403, code: 'own_work' }],
  ['a draft change is approved', 'draft', 'approve', 'second', {}, { ok: false, http: 409, code: 'wrong_status' }],
  ['an engineer approves it', 'in-review', 'approve', 'engineer', {}, { ok: false, http: 403, code: 'forbidden' }],
  ['an approval from an older read', 'in-review', 'approve', 'second', { stale: true }, { ok: false, http: 409, code: 'stale' }],
  ['its author submits it', 'draft', 'submit', 'librarian', {}, { ok: true, status: 'in-review' }],
  ['a second librarian returns it', 'in-review', 'return', 'second', { comment: 'Name the table page.' }, { ok: true, status: 'draft' }],
  ['a second librarian approves it', 'in-review', 'approve', 'second', {}, { ok: true, status: 'published' }],
];

describe('runStep on reference changes', () => {
  it.each(CHANGE_CASES)('%s', async (_label, state, step, who, input, expected) => {
    const change = await changeIn(state);
    const before = (await ReferenceVersion.findByPk(change.id))!;
    const audits = await auditCount('reference-version', change.id);
    const lockVersion = input.stale ? change.lockVersion - 1 : change.lockVersion;
    await expectOutcome(() => stepReferenceVersion(change.referenceId, 2, step === 'return' ? { step, lockVersion, comment: input.comment! } : { step, lockVersion }, people[who]), expected);
    const after = (await ReferenceVersion.findByPk(change.id))!;
    if (expected.ok) {
      expect(after.status).toBe(expected.status);
      expect(after.lockVersion).toBe(before.lockVersion + 1);
      const entries = await AuditEntry.findAll({ where: { entityType: 'reference-version', entityId: String(change.id) }, order: [['id', 'DESC']] });
      expect(entries).toHaveLength(audits + 1);
      expect([entries[0].action, entries[0].actorId]).toEqual([step, people[who].id]);
      // Approval retires the version it supersedes.
      if (step === 'approve') expect((await ReferenceVersion.findByPk(before.supersedesId!))!).toMatchObject({ status: 'retired', supersededById: change.id });
    } else {
      expect([after.status, after.lockVersion]).toEqual([before.status, before.lockVersion]);
      expect(await auditCount('reference-version', change.id)).toBe(audits);
      expect((await ReferenceVersion.findByPk(before.supersedesId!))!.status).toBe('published');
    }
  });
});

// ---- Shortlists ------------------------------------------------------------------------------

// Harrow Sound's treatment chamber side port (as in the projects tests).
const chamberPort = {
  pressure: { value: 0.5e6 },
  temperature: { min: 15, max: 40 },
  sustainedHours: 5000,
  cycles: 10000,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.04, edge: 'simply-supported' },
};

type ShortlistState = 'open' | 'open-empty' | 'submitted';

/** A shortlist by `author` in a project with the demo checker and the author-checker as members. */
async function shortlistIn(state: ShortlistState, author: Actor = people.engineer) {
  const project = await createProject(author, { name: unique('Runner project'), description: 'Harrow Sound treatment chamber' });
  for (const member of [people.checker, people.authorChecker, people.engineer]) if (member.id !== author.id) await addMember(author, project.id, member.id);
  const lc = await createLoadCase(author, project.id, loadCaseSaveSchema.parse({ name: 'Side port', loadCase: chamberPort }));
  let sl = await createShortlist(author, project.id, { loadCaseId: lc.id, name: unique('Port material') });
  if (state !== 'open-empty') sl = await addItem(author, sl.id, { propertySetId: publishedSetId, note: 'Standard minimums' });
  if (state === 'submitted') sl = await stepShortlist(author, sl.id, 'submit', { lockVersion: sl.lockVersion });
  return sl;
}

const SHORTLIST_CASES: [string, ShortlistState, 'engineer' | 'authorChecker', ShortlistStepName, keyof typeof people, { comment?: string; stale?: boolean }, Expect][] = [
  ['the author submits an empty shortlist', 'open-empty', 'engineer', 'submit', 'engineer', {}, { ok: false, http: 400, code: 'invalid_input', field: 'items' }],
  ['someone else submits it', 'open', 'engineer', 'submit', 'otherEngineer', {}, { ok: false, http: 404, code: 'not_found' }],
  ['a member who is not the author submits it', 'open', 'authorChecker', 'submit', 'engineer', {}, { ok: false, http: 403, code: 'forbidden' }],
  ['a checker checks an open shortlist', 'open', 'engineer', 'check', 'checker', {}, { ok: false, http: 409, code: 'wrong_status' }],
  ['its author, a checker, checks it', 'submitted', 'authorChecker', 'check', 'authorChecker', {}, { ok: false, http: 403, code: 'own_work' }],
  ['its author, an engineer, checks it', 'submitted', 'engineer', 'check', 'engineer', {}, { ok: false, http: 403, code: 'own_work' }],
  ['a member engineer checks it', 'submitted', 'authorChecker', 'check', 'engineer', {}, { ok: false, http: 403, code: 'forbidden' }],
  ['a checker outside the project checks it', 'submitted', 'engineer', 'check', 'outsideChecker', {}, { ok: false, http: 404, code: 'not_found' }],
  ['a check from an older read', 'submitted', 'engineer', 'check', 'checker', { stale: true }, { ok: false, http: 409, code: 'stale' }],
  ['a return without a comment', 'submitted', 'engineer', 'return', 'checker', {}, { ok: false, http: 400, code: 'invalid_input', field: 'comment' }],
  ['the author submits', 'open', 'engineer', 'submit', 'engineer', {}, { ok: true, status: 'submitted' }],
  ['a member checker returns it', 'submitted', 'engineer', 'return', 'checker', { comment: 'Add the creep data.' }, { ok: true, status: 'returned' }],
  ['a member checker checks it', 'submitted', 'engineer', 'check', 'checker', { comment: 'Agreed.' }, { ok: true, status: 'checked' }],
];

describe('runStep on shortlists', () => {
  it.each(SHORTLIST_CASES)('%s', async (_label, state, author, step, who, input, expected) => {
    const sl = await shortlistIn(state, people[author]);
    const audits = await auditCount('shortlist', sl.id);
    await expectOutcome(() => stepShortlist(people[who], sl.id, step, { lockVersion: input.stale ? sl.lockVersion - 1 : sl.lockVersion, comment: input.comment }), expected);
    const after = (await Shortlist.findByPk(sl.id))!;
    const record = await DesignRecord.findOne({ where: { shortlistId: sl.id } });
    if (expected.ok) {
      expect(after.status).toBe(expected.status);
      expect(after.lockVersion).toBe(sl.lockVersion + 1);
      const entry = (await AuditEntry.findAll({ where: { entityType: 'shortlist', entityId: String(sl.id) }, order: [['id', 'DESC']] }))[0];
      expect(await auditCount('shortlist', sl.id)).toBe(audits + 1);
      expect(entry.action).toBe(step);
      // A check freezes its record in the same transaction, and the audit entry names it.
      if (step === 'check') expect(entry.after).toMatchObject({ status: 'checked', designRecordId: record!.id, comment: 'Agreed.' });
      else expect(record).toBeNull();
    } else {
      expect([after.status, after.lockVersion]).toEqual([sl.status, sl.lockVersion]);
      expect(await auditCount('shortlist', sl.id)).toBe(audits);
      expect(record).toBeNull();
    }
  });
});
