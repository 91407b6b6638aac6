// CSV import of property sets, step by step: read the file (read-file.ts), map each row to a
// draft (map-rows.ts), plan materials and references (plan.ts), insert (insert.ts); the template
// is template.ts. Preview writes nothing; import writes every row as a draft in one transaction,
// or nothing at all when any row has a problem.
import { UniqueConstraintError } from 'sequelize';
import { sequelize } from '../../../db/sequelize';
import { AppError, badRequest, conflict } from '../../../errors';
import { recordAudit } from '../../../services/audit';
import type { ImportPreviewDto, ImportResultDto } from '../../../../shared/schemas/library';
import { invalidateCatalogueSnapshot } from '../../property-sets/snapshot';
import type { Actor } from '../service';
import { insertPlanned } from './insert';
import { analyse, previewOf, type Analysis } from './plan';
import { readCsv, type UploadedFile } from './read-file';

export { templateCsv } from './template';
export type { UploadedFile };

/** What the import would do; writes nothing. */
export async function previewImport(file: UploadedFile): Promise<ImportPreviewDto> {
  return previewOf(await analyse(readCsv(file)));
}

/** 400 import_invalid: the issues as structured rows, and as `rows.N.column` fields. */
function invalid(a: Analysis): AppError {
  const fields: Record<string, string> = {};
  for (const issue of a.issues) {
    const key = `rows.${issue.row}.${issue.field}`;
    if (!(key in fields)) fields[key] = issue.message;
  }
  const badRows = a.rows - a.valid;
  return badRequest(
    `${a.issueCount} problem${a.issueCount === 1 ? '' : 's'} in ${badRows} row${badRows === 1 ? '' : 's'}; nothing was imported. Fix them and import the file again.`,
    fields,
    'import_invalid',
    { issues: a.issues, issueCount: a.issueCount },
  );
}

/**
 * Every row becomes a draft drafted by the caller, in ONE transaction with the new materials
 * and references; any problem refuses the whole file. One audit entry records the import.
 */
export async function runImport(file: UploadedFile, actor: Actor): Promise<ImportResultDto> {
  const table = readCsv(file);
  try {
    const ids = await sequelize().transaction(async (transaction) => {
      const a = await analyse(table, transaction);
      if (a.issueCount > 0) throw invalid(a);
      const ids = await insertPlanned(a, actor, transaction);
      await recordAudit(transaction, {
        actorId: actor.id,
        action: 'import',
        entityType: 'import',
        entityId: null,
        before: null,
        after: {
          fileName: file.originalname,
          bytes: file.size,
          created: ids.length,
          firstId: ids[0],
          lastId: ids[ids.length - 1],
          newMaterials: [...a.newMaterials.values()].map((m) => m.name),
          newReferences: a.newReferences.size,
        },
      });
      return ids;
    });
    // Raw SQL skips the model hooks that drop the catalogue snapshot; drop it here, after the commit.
    invalidateCatalogueSnapshot();
    return { created: ids.length, ids };
  } catch (err) {
    // Another import or a librarian created the same material between our read and our write.
    if (err instanceof UniqueConstraintError) {
      throw conflict('Someone added a material with the same name while this file was importing. Import it again.', 'duplicate');
    }
    throw err;
  }
}
