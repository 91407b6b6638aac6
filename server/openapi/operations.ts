import { z } from 'zod';
import { loginSchema } from '../../shared/schemas/auth';
import { propertySetQuerySchema } from '../../shared/schemas/catalogue';
import { confirmationProposalSchema, confirmationQuerySchema, confirmationStepSchema } from '../../shared/schemas/provenance';
import { evaluateRequestSchema, pressureQuerySchema } from '../../shared/schemas/evaluate';
import {
  ratingTableCsvQuerySchema,
  ratingTableDraftSchema,
  ratingTableQuerySchema,
  ratingTableStepSchema,
  ratingTableUpdateSchema,
} from '../../shared/schemas/rating-tables';
import {
  auditQuerySchema,
  caughtMailQuerySchema,
  draftInputSchema,
  outboxQuerySchema,
  draftUpdateSchema,
  libraryQueueQuerySchema,
  materialCreateSchema,
  referenceCreateSchema,
  referenceQuerySchema,
  referenceUpdateSchema,
  referenceVersionQuerySchema,
  referenceVersionStepSchema,
  retireSchema,
  returnSchema,
  transitionSchema,
} from '../../shared/schemas/library';
import {
  invitationAcceptSchema,
  invitationCreateSchema,
  loadCaseSaveSchema,
  loadCaseUpdateSchema,
  memberAddSchema,
  passwordChangeSchema,
  passwordResetRequestSchema,
  passwordResetSchema,
  projectCreateSchema,
  projectUpdateSchema,
  shortlistCreateSchema,
  shortlistItemAddSchema,
  shortlistItemUpdateSchema,
  shortlistReorderSchema,
  shortlistReturnSchema,
  shortlistTransitionSchema,
  userUpdateSchema,
} from '../../shared/schemas/projects';

/** What the route table cannot know by itself: purpose, request schemas, answers. */
export interface OperationDoc {
  summary: string;
  tag: string;
  body?: z.ZodType;
  query?: z.ZodType;
  /** multipart/form-data with one file field. */
  upload?: { field: string; description: string };
  /** Content type of a 200 that is not JSON. */
  produces?: 'application/pdf' | 'text/csv';
  responses?: Record<number, string>;
}

const page = z.object({ limit: z.number().int().min(1).max(5000).optional(), offset: z.number().int().min(0).optional() });

/** One entry per "METHOD /api/path" (Express form). A route without an entry fails the tests. */
export const OPERATIONS: Record<string, OperationDoc> = {
  'GET /api/rating-tables': { tag: 'Rating tables', summary: 'Rating tables (published; librarians also drafts, reviews and retired), optionally of one material', query: ratingTableQuerySchema, responses: { 200: 'The tables' } },
  'GET /api/rating-tables/:id': { tag: 'Rating tables', summary: 'One rating table with its grid, citation and the property sets it covers', responses: { 200: 'The table', 404: 'No such table you can read' } },
  'POST /api/rating-tables': { tag: 'Rating tables', summary: 'Draft a new rating table', body: ratingTableDraftSchema, responses: { 201: 'Draft created', 400: 'Invalid draft' } },
  'PUT /api/rating-tables/:id': { tag: 'Rating tables', summary: 'Save a rating-table draft again (with the lock version read)', body: ratingTableUpdateSchema, responses: { 200: 'Saved', 409: 'Someone saved it since, or it is no longer a draft' } },
  'POST /api/rating-tables/:id/steps': { tag: 'Rating tables', summary: 'Take a review step: submit, approve, return (with comment), revise, retire (with reason); four-eyes for approve and return', body: ratingTableStepSchema, responses: { 200: 'Step taken', 201: 'Revision drafted', 403: 'Not your role, or your own work', 409: 'Stale, or not possible in this status' } },
  'POST /api/rating-tables/csv': { tag: 'Rating tables', summary: "Read a rating table's grid from CSV for the editor (writes nothing); row-level problems as fields", query: ratingTableCsvQuerySchema, upload: { field: 'file', description: 'CSV, UTF-8, at most 1 MB' }, responses: { 200: 'The grid, in SI', 400: 'Problems by row and column' } },
  'GET /api/rating-tables/csv-template': { tag: 'Rating tables', summary: 'The CSV header for a rating-table grid', query: ratingTableCsvQuerySchema, produces: 'text/csv', responses: { 200: 'CSV' } },
  'POST /api/auth/login': {
    tag: 'Account',
    summary: 'Sign in; answers with the user and sets the session cookie. Failed sign-ins are throttled per address and per address and name (429 with Retry-After)',
    body: loginSchema,
    responses: { 200: 'Signed in', 401: 'E-mail or password is incorrect', 403: 'Right password, but the account is deactivated', 429: 'Too many failed sign-ins from this address (or for this name from it); Retry-After says when' },
  },
  'POST /api/auth/logout': { tag: 'Account', summary: 'Sign out (ends the session)', responses: { 204: 'Signed out' } },
  'GET /api/auth/me': { tag: 'Account', summary: 'The signed-in user with the permissions of their role', responses: { 200: 'The user', 401: 'Not signed in' } },
  'POST /api/auth/invitations/accept': { tag: 'Account', summary: 'Accept an invitation: create the account from the one-time link and sign in', body: invitationAcceptSchema, responses: { 201: 'Account created', 400: 'Invalid, used or expired link' } },
  'POST /api/auth/password-reset/request': { tag: 'Account', summary: 'Ask for a password-reset link (same answer, after the same work, whether or not the address has an account; the mail follows the answer)', body: passwordResetRequestSchema, responses: { 202: 'Accepted' } },
  'POST /api/auth/password-reset': { tag: 'Account', summary: 'Set a new password with a one-time reset link; ends the account’s sessions', body: passwordResetSchema, responses: { 200: 'Password changed', 400: 'Invalid, used or expired link' } },
  'POST /api/auth/password': { tag: 'Account', summary: 'Change your own password; ends your other sessions', body: passwordChangeSchema, responses: { 200: 'Password changed', 400: 'Current password wrong or new one too short' } },
  'GET /api/health': { tag: 'Service', summary: 'Health: one database round trip', responses: { 200: 'Up', 503: 'Database unreachable' } },
  'GET /api/openapi.json': { tag: 'Service', summary: 'This description of the API (OpenAPI 3.1)', responses: { 200: 'The document' } },

  'GET /api/property-sets': { tag: 'Catalogue', summary: 'Property sets with their material and reference; filters on family, transparency, service temperature and text', query: propertySetQuerySchema.and(page) },
  'GET /api/property-sets/:id': { tag: 'Catalogue', summary: 'One property set with values (SI), basis, dependence data and reference' },
  'GET /api/materials': { tag: 'Catalogue', summary: 'All materials, by family then name' },
  'POST /api/materials': { tag: 'Library desk', summary: 'Create a material', body: materialCreateSchema, responses: { 201: 'Created', 409: 'A material with that name exists' } },
  'GET /api/materials/:id': { tag: 'Catalogue', summary: 'One material with the property sets the caller may read' },
  'POST /api/evaluate': { tag: 'Calculation', summary: 'Evaluate candidates (catalogue or inline) for a load case; ranked best first, every mode with its model and source. The answer is lean by default (form "lean": model texts, warnings and repeated objects once in texts/objects, candidates and modes as rows named by columns, 6 significant digits); form "full" sends each candidate whole. Both carry excluded: the published sets the filters left out, by reason', body: evaluateRequestSchema, responses: { 200: 'The ranking (lean or full form) with the excluded sets', 429: 'Too many evaluations from this account in a minute (Retry-After)' } },
  'GET /api/pressure': { tag: 'Calculation', summary: 'Gauge pressure at a depth in seawater (UNESCO 1983, inverted) or fresh water', query: pressureQuerySchema },

  'GET /api/library/sets': { tag: 'Library desk', summary: 'Drafts and sets in review (filter by status; mine=true for your own)', query: libraryQueueQuerySchema },
  'GET /api/library/sets/:id': { tag: 'Library desk', summary: 'A property set in any status, with its lock version and history fields' },
  'GET /api/library/sets/:id/changes': { tag: 'Library desk', summary: 'Changed values against the version this set supersedes' },
  'POST /api/library/sets': { tag: 'Library desk', summary: 'Create a draft (with a new material or reference if given)', body: draftInputSchema, responses: { 201: 'Draft created' } },
  'PUT /api/library/sets/:id': { tag: 'Library desk', summary: 'Save a draft (optimistic lock)', body: draftUpdateSchema, responses: { 200: 'Saved', 409: 'Stale lock version or not a draft' } },
  'POST /api/library/sets/:id/submit': { tag: 'Library desk', summary: 'Submit a draft for review (mails the other librarians)', body: transitionSchema },
  'POST /api/library/sets/:id/approve': { tag: 'Library desk', summary: 'Approve and publish (never your own draft); retires the version it supersedes', body: transitionSchema, responses: { 200: 'Published', 403: 'Own work (four-eyes)', 409: 'Stale or wrong status' } },
  'POST /api/library/sets/:id/return': { tag: 'Library desk', summary: 'Return to the author with a comment', body: returnSchema },
  'POST /api/library/sets/:id/revise': { tag: 'Library desk', summary: 'Start a new version of a published set', body: transitionSchema, responses: { 201: 'Revision draft created', 409: 'A revision is already open' } },
  'POST /api/library/sets/:id/retire': { tag: 'Library desk', summary: 'Retire a published set (never deleted)', body: retireSchema },
  'GET /api/library/confirmations': { tag: 'Library desk', summary: 'Value confirmations: the review queue, or one set’s', query: confirmationQuerySchema },
  'POST /api/library/sets/:id/confirmations': { tag: 'Library desk', summary: 'Propose that a value of a published set stands in its source at a location', body: confirmationProposalSchema, responses: { 201: 'Proposed', 409: 'Not published, or already proposed' } },
  'POST /api/library/confirmations/:id/steps': { tag: 'Library desk', summary: 'Approve or reject a value confirmation (four-eyes)', body: confirmationStepSchema, responses: { 200: 'Done', 403: 'Own proposal', 409: 'Stale or decided' } },
  'GET /api/library/import/template.csv': { tag: 'Library desk', summary: 'The CSV import template', produces: 'text/csv' },
  'POST /api/library/import/preview': { tag: 'Library desk', summary: 'Check a CSV file row by row without writing anything', upload: { field: 'file', description: 'UTF-8 CSV, at most 20 MB and 50,000 rows' } },
  'POST /api/library/import': { tag: 'Library desk', summary: 'Import a CSV file as drafts, all or nothing', upload: { field: 'file', description: 'UTF-8 CSV, at most 20 MB and 50,000 rows' }, responses: { 201: 'Imported', 400: 'Row errors; nothing written' } },

  'GET /api/references': { tag: 'References', summary: 'References, with document and use counts: those in use (cited by something published); librarians and administrators also those cited by drafts only', query: referenceQuerySchema },
  'GET /api/references/:id': { tag: 'References', summary: 'One reference with its versions (and, for librarians, a proposed change) and its document versions', responses: { 200: 'The reference', 404: 'No such reference you can read (one cited only by drafts is for librarians and administrators)' } },
  'POST /api/references': { tag: 'References', summary: 'Create a reference', body: referenceCreateSchema, responses: { 201: 'Created' } },
  'PUT /api/references/:id': { tag: 'References', summary: 'Edit a reference (optimistic lock). Not in use: saved in place. In use: proposes the change as a new version for a second librarian to review; the published citation stays until approved', body: referenceUpdateSchema, responses: { 200: 'Saved in place', 202: 'Proposed as a new version, waiting for review', 400: 'Invalid, or changes nothing', 409: 'Stale, or a proposed change is already open' } },
  'PUT /api/references/:id/versions/:version': { tag: 'References', summary: 'Save a proposed change (a version in draft) again, with the lock version read', body: referenceUpdateSchema, responses: { 200: 'Saved', 404: 'No such version', 409: 'Stale, or no longer a draft' } },
  'POST /api/references/:id/versions/:version/steps': { tag: 'References', summary: 'Take a review step on a proposed change: submit, approve (publishes it; four-eyes), return with a comment', body: referenceVersionStepSchema, responses: { 200: 'Step taken', 403: 'Not your role, or your own work', 404: 'No such version', 409: 'Stale, or not possible in this status' } },
  'POST /api/references/:id/document': { tag: 'References', summary: 'Upload the source PDF as its next document version (checked by content, at most 20 MB); earlier versions stay', upload: { field: 'file', description: 'A PDF' }, responses: { 200: 'Stored', 400: 'Not a PDF', 413: 'Too large' } },
  'GET /api/references/:id/document': { tag: 'References', summary: 'Download the latest document version', produces: 'application/pdf', responses: { 200: 'The PDF', 404: 'No document, or no such reference you can read' } },
  'GET /api/references/:id/documents': { tag: 'References', summary: 'Every document version of a reference, newest first', responses: { 200: 'The versions', 404: 'No such reference you can read' } },
  'GET /api/references/:id/documents/:version': { tag: 'References', summary: 'Download one document version (a design record names the one it was frozen with)', produces: 'application/pdf', responses: { 200: 'The PDF', 404: 'No such version, or no such reference you can read' } },
  'GET /api/library/reference-versions': { tag: 'Library desk', summary: 'Proposed changes to references in use (draft and in review, or one of them), for the review queue', query: referenceVersionQuerySchema, responses: { 200: 'The proposed changes' } },

  'GET /api/admin/audit': { tag: 'Administration', summary: 'Audit log, newest first', query: auditQuerySchema },
  'GET /api/admin/mail': { tag: 'Administration', summary: 'Mail caught by the local SMTP catcher (development and test only)', query: caughtMailQuerySchema },
  'GET /api/admin/mail/:id': { tag: 'Administration', summary: 'One caught message' },
  'GET /api/admin/users': { tag: 'Administration', summary: 'All accounts' },
  'PATCH /api/admin/users/:id': {
    tag: 'Administration',
    summary: 'Change a role or deactivate an account (its sessions end at once); the last active administrator stays one',
    body: userUpdateSchema,
    responses: { 200: 'Changed', 409: 'Your own account, or the last active administrator' },
  },
  'GET /api/admin/sign-in-locks': { tag: 'Administration', summary: 'Failed sign-ins still counted, per address and per address and name, with their locks' },
  'DELETE /api/admin/sign-in-locks/:id': { tag: 'Administration', summary: 'Clear one sign-in counter and its lock', responses: { 204: 'Cleared', 404: 'No such counter' } },
  'GET /api/admin/invitations': { tag: 'Administration', summary: 'Invitations and their state' },
  'POST /api/admin/invitations': {
    tag: 'Administration',
    summary: 'Invite someone by e-mail with a one-time, expiring link; a live invitation to the same address is revoked by it. `mail` says whether the mail server took the message or the outbox retries it',
    body: invitationCreateSchema,
    responses: { 201: 'Invited', 409: 'The address has an account' },
  },
  'POST /api/admin/invitations/:id/revoke': { tag: 'Administration', summary: 'Revoke an invitation: its link stops working', responses: { 200: 'Revoked', 404: 'No such invitation', 409: 'Already accepted or revoked' } },
  'POST /api/admin/invitations/:id/resend': { tag: 'Administration', summary: 'Send an invitation again with a new link and expiry (the old link stops working)', responses: { 200: 'Sent or queued', 404: 'No such invitation', 409: 'Accepted, revoked, or the address has an account' } },
  'GET /api/admin/outbox': { tag: 'Administration', summary: 'Outgoing mail and how it fared: sent, waiting for another attempt (with the last error), or failed', query: outboxQuerySchema },

  'GET /api/projects': { tag: 'Projects', summary: 'Your projects (administrators: all)' },
  'POST /api/projects': { tag: 'Projects', summary: 'Create a project; you become its owner', body: projectCreateSchema, responses: { 201: 'Created' } },
  'GET /api/projects/:id': { tag: 'Projects', summary: 'A project with its members (404 unless you are a member)' },
  'PATCH /api/projects/:id': { tag: 'Projects', summary: 'Rename or describe a project (owner or administrator; optimistic lock)', body: projectUpdateSchema, responses: { 200: 'Saved', 409: 'Someone saved it since (stale)' } },
  'POST /api/projects/:id/members': { tag: 'Projects', summary: 'Add a member (owner or administrator)', body: memberAddSchema },
  'DELETE /api/projects/:id/members/:userId': { tag: 'Projects', summary: 'Remove a member (owner or administrator)' },
  'GET /api/projects/:id/load-cases': { tag: 'Projects', summary: 'Saved load cases of a project' },
  'POST /api/projects/:id/load-cases': { tag: 'Projects', summary: 'Save a load case to a project', body: loadCaseSaveSchema, responses: { 201: 'Saved' } },
  'GET /api/projects/:id/shortlists': { tag: 'Projects', summary: 'Shortlists of a project' },
  'POST /api/projects/:id/shortlists': { tag: 'Projects', summary: 'Start a shortlist for a saved load case', body: shortlistCreateSchema, responses: { 201: 'Created' } },
  'GET /api/projects/:id/records': { tag: 'Projects', summary: 'Design records of a project' },
  'GET /api/people': { tag: 'Projects', summary: 'Active accounts, to add as project members' },
  'GET /api/load-cases/:id': { tag: 'Projects', summary: 'A saved load case' },
  'PUT /api/load-cases/:id': { tag: 'Projects', summary: 'Edit a saved load case (optimistic lock; refused once a checked shortlist uses it)', body: loadCaseUpdateSchema },
  'GET /api/shortlists/awaiting-check': { tag: 'Shortlists', summary: 'Shortlists submitted by others in your projects, waiting for your check (oldest first)' },
  'GET /api/shortlists/:id': { tag: 'Shortlists', summary: 'A shortlist with its candidates evaluated live against the load case' },
  'POST /api/shortlists/:id/items': { tag: 'Shortlists', summary: 'Add a published property set with a note', body: shortlistItemAddSchema, responses: { 201: 'Added', 409: 'Already on the shortlist, or the shortlist is no longer open' } },
  'PATCH /api/shortlists/:id/items/:itemId': { tag: 'Shortlists', summary: 'Edit a candidate’s note (optimistic lock on the item)', body: shortlistItemUpdateSchema, responses: { 200: 'Saved', 409: 'Someone saved the note since (stale), or the shortlist is no longer open' } },
  'DELETE /api/shortlists/:id/items/:itemId': { tag: 'Shortlists', summary: 'Take a candidate off an open shortlist' },
  'POST /api/shortlists/:id/reorder': { tag: 'Shortlists', summary: 'Put the candidates in a new order', body: shortlistReorderSchema },
  'POST /api/shortlists/:id/submit': { tag: 'Shortlists', summary: 'Submit for checking (mails the project’s checkers)', body: shortlistTransitionSchema },
  'POST /api/shortlists/:id/check': { tag: 'Shortlists', summary: 'Check a submitted shortlist (never your own); freezes the design record', body: shortlistTransitionSchema, responses: { 200: 'Checked', 403: 'Own work or not a checker of the project' } },
  'POST /api/shortlists/:id/return': { tag: 'Shortlists', summary: 'Return a submitted shortlist with a comment', body: shortlistReturnSchema },
  'GET /api/records/:id': { tag: 'Design records', summary: 'A frozen design record, and whether newer catalogue data exists' },
  'GET /api/records/:id/pdf': { tag: 'Design records', summary: 'The design record as a PDF', produces: 'application/pdf' },
};
