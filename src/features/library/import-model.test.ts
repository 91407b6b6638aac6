import { describe, expect, it } from 'vitest';
import { countDataRows, importIssuesOf, issuesFromImportError } from './import-model';

describe('CSV import helpers', () => {
  it('counts data rows without the header, a trailing newline or CRLF endings', () => {
    expect(countDataRows('material,family\n')).toBe(0);
    expect(countDataRows('material,family\nCast acrylic,acrylic\nTitanium grade 5,titanium-alloy')).toBe(2);
    expect(countDataRows('material,family\r\nCast acrylic,acrylic\r\n\r\n')).toBe(1);
    expect(countDataRows('')).toBe(0);
  });

  it('does not count a newline inside a quoted field as a row', () => {
    expect(countDataRows('material,condition\n"Cast acrylic","sheet,\nannealed"\nGlass,"tempered"\n')).toBe(2);
  });

  it('turns the server’s row paths into sorted issues', () => {
    expect(
      issuesFromImportError({
        'rows.12.tensile_strength_mpa': 'must be a number',
        'rows.3.family': 'unknown family',
        'rows.3': 'duplicate row',
        file: 'odd',
      }),
    ).toEqual([
      { row: 0, field: 'file', message: 'odd' },
      { row: 3, field: '', message: 'duplicate row' },
      { row: 3, field: 'family', message: 'unknown family' },
      { row: 12, field: 'tensile_strength_mpa', message: 'must be a number' },
    ]);
  });

  it('takes a refused import’s structured issues and full count when the server sends them', () => {
    const issues = [
      { row: 4, field: 'service_temp_max_c', message: 'min must not exceed max' },
      { row: 4, field: 'density_kg_m3', message: 'must be a number' },
    ];
    const fields = { 'rows.4.service_temp_max_c': 'min must not exceed max', 'rows.4.density_kg_m3': 'must be a number' };
    expect(importIssuesOf({ fields, rows: { issues, issueCount: 612 } })).toEqual({ issues, issueCount: 612 });
    expect(importIssuesOf({ fields })).toEqual({
      issues: [
        { row: 4, field: 'density_kg_m3', message: 'must be a number' },
        { row: 4, field: 'service_temp_max_c', message: 'min must not exceed max' },
      ],
      issueCount: 2,
    });
  });
});
