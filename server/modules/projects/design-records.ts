// Design records: the frozen result of a checked shortlist, read back as it was signed, with a
// note where the catalogue has newer data for one of its candidates.
import { DesignRecord } from '../../db/models/projects';
import { PropertySet } from '../../db/models';
import type { DesignRecordDto, DesignRecordSummaryDto } from '../../../shared/schemas/projects';
import { notFound } from '../../errors';
import { visibleProject, type Actor } from './access';
import { newerVersions } from './shortlists';

export async function getDesignRecord(actor: Actor, recordId: number): Promise<DesignRecordDto> {
  const record = await DesignRecord.findByPk(recordId);
  if (!record) throw notFound('Design record');
  await visibleProject(actor, record.projectId).catch(() => {
    throw notFound('Design record');
  });
  const sets = record.content.candidates.map((c) => c.propertySet);
  const rows = await PropertySet.findAll({ where: { id: sets.map((s) => s.id) }, attributes: ['id', 'lineageId'] });
  const newer = await newerVersions(sets, new Map(rows.map((r) => [r.id, r.lineageId])));
  return {
    id: record.id,
    shortlistId: record.shortlistId,
    projectId: record.projectId,
    content: record.content,
    newerData: record.content.candidates
      .filter((c) => newer.has(c.propertySet.id))
      .map((c) => ({ propertySetId: c.propertySet.id, newerVersionId: newer.get(c.propertySet.id)!, name: c.result.name })),
    createdAt: record.createdAt.toISOString(),
  };
}

export async function listDesignRecords(actor: Actor, projectId: number): Promise<DesignRecordSummaryDto[]> {
  await visibleProject(actor, projectId);
  const rows = await DesignRecord.findAll({ where: { projectId }, order: [['createdAt', 'DESC']] });
  return rows.map((r) => ({
    id: r.id,
    shortlistId: r.shortlistId,
    name: r.content.shortlist.name,
    loadCase: r.content.loadCase.name,
    author: r.content.author.name,
    checker: r.content.checker.name,
    checkedAt: r.content.shortlist.checkedAt,
  }));
}
