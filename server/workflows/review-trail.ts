// What the DTO of every reviewed row says about its review (who drafted, last edited and approved
// it; the returned comment; when it was submitted and published), and the includes that load it;
// a curated record's identity in its lineage.
import { User } from '../db/models';
import type { CuratedModel, WorkflowModel } from '../db/models/columns';
import type { ReviewTrailDto, UserRefDto } from '../../shared/schemas/catalogue';

/** A curated record's place in its lineage (version 1 is its own lineage's first id). */
export const curatedIdentity = (row: CuratedModel) => ({ id: row.id, status: row.status, version: row.version, lineageId: row.lineageId ?? row.id });

/** A person as the DTOs name them. */
export const userRef = (u: User | null | undefined): UserRefDto | null => (u ? { id: u.id, name: u.name } : null);

/** Needs the people loaded with `reviewTrailInclude()`. */
export function reviewTrailDto(row: WorkflowModel): ReviewTrailDto {
  return {
    draftedBy: userRef(row.draftedBy),
    lastEditedBy: userRef(row.lastEditedBy),
    approvedBy: userRef(row.approvedBy),
    returnedComment: row.returnedComment ?? null,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    publishedAt: row.publishedAt?.toISOString() ?? null,
  };
}

/** The people of a review trail, by name only. */
export const reviewTrailInclude = () => [
  { model: User, as: 'draftedBy', attributes: ['id', 'name'] },
  { model: User, as: 'lastEditedBy', attributes: ['id', 'name'] },
  { model: User, as: 'approvedBy', attributes: ['id', 'name'] },
];
