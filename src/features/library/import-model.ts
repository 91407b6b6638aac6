import type { ImportIssueDto } from '@shared/schemas/library';
import type { ApiError } from '@/lib/api-client';

/**
 * Data rows in a CSV text, for the "checking about N rows" estimate while the server works:
 * newlines outside quoted fields, less the header and a trailing empty line.
 */
export function countDataRows(text: string): number {
  let lines = 0;
  let quoted = false;
  let lastWasNewline = true;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 34 /* " */) quoted = !quoted;
    else if (c === 10 /* \n */ && !quoted) {
      if (!lastWasNewline) lines++;
      lastWasNewline = true;
      continue;
    } else if (c !== 13 /* \r */) lastWasNewline = false;
  }
  if (!lastWasNewline) lines++;
  return Math.max(0, lines - 1);
}

/** The server's 400 "import_invalid" fields ({ "rows.12.tensile_strength_mpa": "must be a number" }) as issues. */
export function issuesFromImportError(fields: Record<string, string>): ImportIssueDto[] {
  return Object.entries(fields)
    .map(([path, message]) => {
      const m = /^rows\.(\d+)(?:\.(.+))?$/.exec(path);
      return m ? { row: Number(m[1]), field: m[2] ?? '', message } : { row: 0, field: path, message };
    })
    .sort((a, b) => a.row - b.row || a.field.localeCompare(b.field));
}

/**
 * The row issues of a refused import: the structured list the server sends with 400
 * "import_invalid" (in its order, with the full count), else read back from the fields.
 */
export function importIssuesOf(error: Pick<ApiError, 'fields' | 'rows'>): { issues: ImportIssueDto[]; issueCount: number } {
  if (error.rows) return { issues: error.rows.issues, issueCount: error.rows.issueCount };
  const issues = issuesFromImportError(error.fields);
  return { issues, issueCount: issues.length };
}
