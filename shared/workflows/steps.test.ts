// The workflow tables and allowedSteps, table by table: the tables are consistent, and each
// viewer gets exactly the steps the review rules give them (four-eyes, author only, members).
import { describe, expect, it } from 'vitest';
import { PERMISSIONS, type Role } from '../roles';
import { SHORTLIST_STATUSES } from '../schemas/projects';
import { CURATED_STATUSES, CURATED_STEPS } from './curated';
import { REFERENCE_VERSION_STEPS } from './reference-version';
import { SHORTLIST_STEPS } from './shortlist';
import { allowedSteps, stepCommentSchema, stepRefusal, type StepRule, type WorkflowSubject } from './steps';

const TABLES: [string, readonly StepRule<string, string>[], readonly string[]][] = [
  ['curated', CURATED_STEPS, CURATED_STATUSES],
  ['reference version', REFERENCE_VERSION_STEPS, CURATED_STATUSES],
  ['shortlist', SHORTLIST_STEPS, SHORTLIST_STATUSES],
];

describe.each(TABLES)('the %s table', (_name, steps, statuses) => {
  it('names each step once, from and to statuses of its kind, with a known permission', () => {
    expect(new Set(steps.map((s) => s.name)).size).toBe(steps.length);
    for (const step of steps) {
      expect(step.from.length).toBeGreaterThan(0);
      for (const from of step.from) expect(statuses).toContain(from);
      if (step.to !== 'new-version') expect(statuses).toContain(step.to);
      expect(step.from).not.toContain(step.to);
      expect(PERMISSIONS).toContain(step.permission);
    }
  });

  it('says under which name the audit log keeps the words of every step that asks for them', () => {
    for (const step of steps.filter((s) => s.comment !== 'none')) expect(step.commentAs).toMatch(/^(comment|reason)$/);
  });

  it('never lets the author review their own work: every step into a final or checked state is four-eyes or revises', () => {
    for (const step of steps.filter((s) => s.to === 'published' || s.to === 'checked')) expect(step.fourEyes).toBe(true);
  });
});

const AUTHOR = 7;
const OTHER = 8;
const v = (id: number, role: Role) => ({ id, role });
const curated = (status: (typeof CURATED_STATUSES)[number], facts = { cited: true }): WorkflowSubject<string> => ({ status, authorIds: [AUTHOR, null], facts });
const shortlist = (status: (typeof SHORTLIST_STATUSES)[number], hasItems = true, memberIds: number[] | null = [AUTHOR, OTHER]): WorkflowSubject<string> => ({
  status,
  authorIds: [AUTHOR],
  memberIds,
  facts: { hasItems },
});

/** Each row: table, record, viewer, and for every step of the table 'ok' or the refusal code. */
const CASES: [string, readonly StepRule<string, string>[], WorkflowSubject<string>, { id: number; role: Role }, Record<string, string>][] = [
  ['a draft, for its author', CURATED_STEPS, curated('draft'), v(AUTHOR, 'librarian'), { submit: 'ok', approve: 'wrong-status', return: 'wrong-status', revise: 'wrong-status', retire: 'wrong-status' }],
  ['a set in review, for its author', CURATED_STEPS, curated('in-review'), v(AUTHOR, 'librarian'), { submit: 'wrong-status', approve: 'own-work', return: 'own-work', revise: 'wrong-status', retire: 'wrong-status' }],
  ['a set in review, for a second librarian', CURATED_STEPS, curated('in-review'), v(OTHER, 'librarian'), { submit: 'wrong-status', approve: 'ok', return: 'ok', revise: 'wrong-status', retire: 'wrong-status' }],
  ['a set in review without a reference', CURATED_STEPS, curated('in-review', { cited: false }), v(OTHER, 'librarian'), { submit: 'wrong-status', approve: 'unmet', return: 'ok', revise: 'wrong-status', retire: 'wrong-status' }],
  ['a set in review, for an engineer', CURATED_STEPS, curated('in-review'), v(OTHER, 'engineer'), { submit: 'wrong-status', approve: 'no-role', return: 'no-role', revise: 'wrong-status', retire: 'wrong-status' }],
  ['a published set, for its author', CURATED_STEPS, curated('published'), v(AUTHOR, 'librarian'), { submit: 'wrong-status', approve: 'wrong-status', return: 'wrong-status', revise: 'ok', retire: 'ok' }],
  ['a retired set', CURATED_STEPS, curated('retired'), v(OTHER, 'admin'), { submit: 'wrong-status', approve: 'wrong-status', return: 'wrong-status', revise: 'wrong-status', retire: 'wrong-status' }],
  ['a proposed reference change, for its author', REFERENCE_VERSION_STEPS, curated('draft'), v(AUTHOR, 'librarian'), { submit: 'ok', approve: 'wrong-status', return: 'wrong-status' }],
  ['a reference change in review, for its author', REFERENCE_VERSION_STEPS, curated('in-review'), v(AUTHOR, 'librarian'), { submit: 'wrong-status', approve: 'own-work', return: 'own-work' }],
  ['a reference change in review, for a second librarian', REFERENCE_VERSION_STEPS, curated('in-review'), v(OTHER, 'librarian'), { submit: 'wrong-status', approve: 'ok', return: 'ok' }],
  ['a reference change in review, for an administrator', REFERENCE_VERSION_STEPS, curated('in-review'), v(OTHER, 'admin'), { submit: 'wrong-status', approve: 'ok', return: 'ok' }],
  ['a reference change in review, for a checker', REFERENCE_VERSION_STEPS, curated('in-review'), v(OTHER, 'checker'), { submit: 'wrong-status', approve: 'no-role', return: 'no-role' }],
  ['a published reference version', REFERENCE_VERSION_STEPS, curated('published'), v(OTHER, 'librarian'), { submit: 'wrong-status', approve: 'wrong-status', return: 'wrong-status' }],
  ['an open shortlist, for its author', SHORTLIST_STEPS, shortlist('open'), v(AUTHOR, 'engineer'), { submit: 'ok', check: 'wrong-status', return: 'wrong-status' }],
  ['an empty open shortlist, for its author', SHORTLIST_STEPS, shortlist('open', false), v(AUTHOR, 'engineer'), { submit: 'unmet', check: 'wrong-status', return: 'wrong-status' }],
  ['an open shortlist, for another engineer', SHORTLIST_STEPS, shortlist('open'), v(OTHER, 'engineer'), { submit: 'not-author', check: 'wrong-status', return: 'wrong-status' }],
  ['a returned shortlist, for its author', SHORTLIST_STEPS, shortlist('returned'), v(AUTHOR, 'engineer'), { submit: 'ok', check: 'wrong-status', return: 'wrong-status' }],
  ['a submitted shortlist, for its author who is a checker', SHORTLIST_STEPS, shortlist('submitted'), v(AUTHOR, 'checker'), { submit: 'wrong-status', check: 'own-work', return: 'own-work' }],
  ['a submitted shortlist, for a member checker', SHORTLIST_STEPS, shortlist('submitted'), v(OTHER, 'checker'), { submit: 'wrong-status', check: 'ok', return: 'ok' }],
  ['a submitted shortlist, for a member engineer', SHORTLIST_STEPS, shortlist('submitted'), v(OTHER, 'engineer'), { submit: 'wrong-status', check: 'no-role', return: 'no-role' }],
  ['a submitted shortlist, for a checker outside the project', SHORTLIST_STEPS, shortlist('submitted'), v(10, 'checker'), { submit: 'wrong-status', check: 'not-member', return: 'not-member' }],
  ['a submitted shortlist, for an admin outside the project', SHORTLIST_STEPS, shortlist('submitted'), v(1, 'admin'), { submit: 'wrong-status', check: 'ok', return: 'ok' }],
  ['a submitted shortlist whose members are not known here', SHORTLIST_STEPS, shortlist('submitted', true, null), v(10, 'checker'), { submit: 'wrong-status', check: 'ok', return: 'ok' }],
  ['a checked shortlist', SHORTLIST_STEPS, shortlist('checked'), v(OTHER, 'checker'), { submit: 'wrong-status', check: 'wrong-status', return: 'wrong-status' }],
];

describe('allowedSteps', () => {
  it.each(CASES)('%s', (_label, steps, subject, viewer, expected) => {
    const got = Object.fromEntries(allowedSteps(steps, subject, viewer).map((a) => [a.step.name, a.allowed ? 'ok' : a.code]));
    expect(got).toEqual(expected);
  });

  it('gives every refusal a reason in words, in the table’s own words where it has them', () => {
    for (const [, steps, subject, viewer] of CASES) {
      for (const a of allowedSteps(steps, subject, viewer).filter((x) => !x.allowed)) {
        expect(a.reason).toMatch(/\w{3,}.*\.$/);
        const own = a.step.refusals?.[a.code!];
        if (own) expect(a.reason).toBe(own);
      }
    }
    expect(stepRefusal(SHORTLIST_STEPS[1], shortlist('submitted'), v(AUTHOR, 'checker'))?.reason).toBe('A shortlist is checked by a second engineer, never by its author.');
    expect(stepRefusal(SHORTLIST_STEPS[0], shortlist('open', false), v(AUTHOR, 'engineer'))?.reason).toBe('Add at least one candidate before submitting.');
  });
});

describe('stepCommentSchema', () => {
  const byName = (steps: readonly StepRule<string, string>[], name: string) => steps.find((s) => s.name === name)!;

  it('asks a return for a comment of a few words, and a retirement for its reason', () => {
    expect(stepCommentSchema(byName(CURATED_STEPS, 'return')).safeParse({ comment: ' ok ' }).success).toBe(false);
    expect(stepCommentSchema(byName(CURATED_STEPS, 'return')).safeParse({ comment: 'Cite the table page.' }).success).toBe(true);
    const retire = stepCommentSchema(byName(CURATED_STEPS, 'retire')).safeParse({ comment: '' });
    expect(retire.success).toBe(false);
    expect(retire.error?.issues[0].message).toMatch(/reason/);
  });

  it('lets a check go without a comment, but not with a novel', () => {
    const check = stepCommentSchema(byName(SHORTLIST_STEPS, 'check'));
    expect(check.safeParse({ comment: '' }).success).toBe(true);
    expect(check.safeParse({}).success).toBe(true);
    expect(check.safeParse({ comment: 'x'.repeat(4001) }).success).toBe(false);
  });
});
