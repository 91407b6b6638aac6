/**
 * Contracts of projects, load cases, shortlists, sign-off, design records and team
 * administration. All values SI.
 */
import { z } from 'zod';
import { oneLineText } from './text';
import { loadCaseSchema, evaluateFiltersSchema, type LoadCase } from './evaluate';
import { roleSchema, type Role } from './auth';
import type { CandidateResult, EvaluateResult } from '../engine/types';
import type { PropertySetDto } from './catalogue';

const id = z.number().int().positive().max(2_147_483_647);
const lockVersion = z.number().int().min(0).max(2_147_483_647);
const name = (what: string) => oneLineText({ min: 1, max: 200, required: `Give the ${what} a name` });

export const projectCreateSchema = z
  .object({ name: name('project'), description: z.string().trim().max(4000).default('') })
  .strict();
export const projectUpdateSchema = z
  .object({ lockVersion, name: name('project').optional(), description: z.string().trim().max(4000).optional() })
  .strict();
export const memberAddSchema = z.object({ userId: id }).strict();

export const loadCaseSaveSchema = z
  .object({
    name: name('load case'),
    loadCase: loadCaseSchema,
    filters: evaluateFiltersSchema.optional(),
    notes: z.string().trim().max(4000).default(''),
  })
  .strict();
export const loadCaseUpdateSchema = loadCaseSaveSchema.extend({ lockVersion }).strict();

export const shortlistCreateSchema = z.object({ loadCaseId: id, name: name('shortlist') }).strict();
export const shortlistItemAddSchema = z
  .object({ propertySetId: id, note: z.string().trim().max(2000).default('') })
  .strict();
export const shortlistItemUpdateSchema = z.object({ lockVersion, note: z.string().trim().max(2000) }).strict();
export const shortlistReorderSchema = z.object({ lockVersion, itemIds: z.array(id).min(1).max(200) }).strict();
export const shortlistTransitionSchema = z
  .object({ lockVersion, comment: z.string().trim().max(4000).optional() })
  .strict();
export const shortlistReturnSchema = z
  .object({ lockVersion, comment: z.string().trim().min(3, 'Say what the author must change').max(4000) })
  .strict();

export const SHORTLIST_STATUSES = ['open', 'submitted', 'checked', 'returned'] as const;
export type ShortlistStatus = (typeof SHORTLIST_STATUSES)[number];

// ---- Team administration -------------------------------------------------------------------

const email = z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address')).pipe(z.string().max(254));
/** Common practice: at least 12 characters; no composition rules (NIST SP 800-63B §5.1.1). */
export const passwordSchema = z.string().min(12, 'Use at least 12 characters').max(200, 'Use at most 200 characters');

export const invitationCreateSchema = z.object({ email, role: roleSchema }).strict();
export const invitationAcceptSchema = z
  .object({ token: z.string().trim().min(20).max(200), name: oneLineText({ min: 1, max: 200, required: 'Enter your name' }), password: passwordSchema })
  .strict();
export const userUpdateSchema = z.object({ role: roleSchema.optional(), active: z.boolean().optional() }).strict();
export const passwordChangeSchema = z
  .object({ currentPassword: z.string().min(1, 'Enter your current password').max(200), newPassword: passwordSchema })
  .strict();
export const passwordResetRequestSchema = z.object({ email }).strict();
export const passwordResetSchema = z.object({ token: z.string().trim().min(20).max(200), password: passwordSchema }).strict();

// ---- DTOs ------------------------------------------------------------------------------------

export interface UserSummaryDto {
  id: number;
  name: string;
  email: string;
  role: Role;
}

export interface ProjectDto {
  id: number;
  name: string;
  description: string;
  owner: UserSummaryDto;
  members: UserSummaryDto[];
  createdAt: string;
  updatedAt: string;
  /** For PATCH: a change made from an older read gets 409 stale. */
  lockVersion: number;
  /** awaitingCheck: shortlists submitted and not yet checked or returned. */
  counts: { loadCases: number; shortlists: number; checked: number; awaitingCheck: number };
}

/** A row of GET /api/shortlists/awaiting-check: a shortlist submitted by someone else, waiting for the caller's check. */
export interface AwaitingCheckDto {
  id: number;
  name: string;
  project: { id: number; name: string };
  author: { id: number; name: string };
  submittedAt: string;
  itemCount: number;
  /** Candidates whose governing margin is below zero at submission (they miss their target). */
  belowTarget: string[];
}

export interface LoadCaseDto {
  id: number;
  projectId: number;
  name: string;
  loadCase: LoadCase;
  filters: z.infer<typeof evaluateFiltersSchema> | null;
  notes: string;
  createdBy: UserSummaryDto | null;
  lockVersion: number;
  updatedAt: string;
}

export interface ShortlistItemDto {
  id: number;
  position: number;
  note: string;
  /** For editing the note: a save made from an older read gets 409 stale. */
  lockVersion: number;
  propertySet: PropertySetDto;
  /** Live evaluation against the shortlist's load case (null once a record is frozen: use the record). */
  result: CandidateResult | null;
  /** The catalogue has a newer published version of this set. */
  newerVersionId: number | null;
}

/** One round of checking: a submission and what became of it. */
export interface ShortlistRoundDto {
  round: number;
  submittedAt: string;
  submittedBy: { id: number; name: string };
  loadCase: { id: number; name: string; input: LoadCase };
  candidates: { propertySetId: number; name: string; version: number; note: string }[];
  /** What changed against the round before, in words (empty for the first round). */
  changes: string[];
  outcome: 'returned' | 'checked' | null;
  decidedAt: string | null;
  decidedBy: { id: number; name: string } | null;
  comment: string | null;
}

/** What a submission froze: the checker reviews it and the design record is made from it. */
export interface ShortlistSubmission {
  round: number;
  submittedAt: string;
  loadCase: LoadCaseDto;
  evaluation: Omit<EvaluateResult, 'results' | 'total'> | null;
  items: { id: number; position: number; note: string; lockVersion?: number; propertySet: PropertySetDto; result: CandidateResult | null }[];
}

export interface ShortlistDto {
  id: number;
  projectId: number;
  name: string;
  status: ShortlistStatus;
  loadCase: LoadCaseDto;
  author: UserSummaryDto;
  checker: UserSummaryDto | null;
  submittedAt: string | null;
  checkedAt: string | null;
  returnedComment: string | null;
  checkComment: string | null;
  lockVersion: number;
  items: ShortlistItemDto[];
  /** Pressure etc. of the evaluation shown (the submitted one while submitted or checked). */
  evaluation: Omit<EvaluateResult, 'results' | 'total'> | null;
  /** True while submitted or checked: load case, items and results are those submitted, not today's. */
  frozenInputs: boolean;
  rounds: ShortlistRoundDto[];
  designRecordId: number | null;
}

/** What a design record freezes: everything needed to read and defend it later, unchanged. */
export interface DesignRecordContent {
  format: 'isobath-design-record';
  /** 1: before rounds were kept; 2: with `rounds`. */
  formatVersion: 1 | 2;
  project: { id: number; name: string };
  shortlist: { id: number; name: string; submittedAt: string; checkedAt: string; checkComment: string | null };
  author: UserSummaryDto;
  checker: UserSummaryDto;
  loadCase: { name: string; input: LoadCase; notes: string };
  pressure: number;
  proofTestPressure: number;
  pressureMethod: string;
  candidates: {
    position: number;
    note: string;
    propertySet: PropertySetDto;
    result: CandidateResult;
  }[];
  cautions: string;
  engine: { models: string[] };
  frozenAt: string;
  /** Every round of checking up to this check (format 2). */
  rounds?: ShortlistRoundDto[];
}

export interface DesignRecordDto {
  id: number;
  shortlistId: number;
  projectId: number;
  content: DesignRecordContent;
  /** Property sets in the record that have a newer published version today. */
  newerData: { propertySetId: number; newerVersionId: number; name: string }[];
  createdAt: string;
}

/** A row of GET /api/projects/:id/shortlists. */
export interface ShortlistSummaryDto {
  id: number;
  name: string;
  status: ShortlistStatus;
  loadCaseId: number;
  author: { id: number; name: string };
  itemCount: number;
  designRecordId: number | null;
  updatedAt: string;
}

/** A row of GET /api/projects/:id/records. */
export interface DesignRecordSummaryDto {
  id: number;
  shortlistId: number;
  name: string;
  loadCase: string;
  author: string;
  checker: string;
  checkedAt: string;
}

// ---- Team administration ---------------------------------------------------------------------

/** A row of GET /api/admin/users, and the answer to changing one. */
export interface AdminUserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  lastLoginAt: string | null;
  createdAt: string;
}

export type InvitationState = 'waiting' | 'accepted' | 'expired' | 'revoked';

/** How an outgoing message fared: sent, waiting for another attempt, or given up. */
export interface MailDeliveryDto {
  status: 'pending' | 'sent' | 'failed';
  attempts: number;
  /** The mail server's last refusal or the connection error, while not sent. */
  lastError: string | null;
  /** When the next attempt is due (pending only). */
  nextAttemptAt: string | null;
  sentAt: string | null;
}

/** A row of GET /api/admin/invitations. */
export interface InvitationDto {
  id: number;
  email: string;
  role: Role;
  createdAt: string;
  expiresAt: string;
  state: InvitationState;
  /** When the link was last sent (created, or renewed by resending). */
  sentAt: string;
  revokedAt: string | null;
  /** Its latest e-mail (null for invitations from before the outbox). */
  mail: MailDeliveryDto | null;
}

/** A row of GET /api/admin/sign-in-locks: failed sign-ins counted for one address, across names (email null) or for one name. */
export interface SignInLockDto {
  id: number;
  address: string;
  email: string | null;
  failures: number;
  /** Until when sign-ins from the address (for the name, when given) wait; null while only counted. */
  lockedUntil: string | null;
  lastFailureAt: string;
}

/** The answer to POST /api/admin/invitations. */
export type InvitationCreatedDto = Pick<InvitationDto, 'id' | 'email' | 'role' | 'expiresAt'> & {
  /** sent: the mail server took it; queued: it did not answer in time or refused, and the outbox tries again. */
  mail: 'sent' | 'queued';
  /** Live invitations to the same address that this one replaced. */
  replaced: number;
};
