import { describe, expect, it } from 'vitest';
import { ROLE_PERMISSIONS } from '@shared/schemas/auth';
import { comparisonRows, moveItem, shortlistRights, type Viewer } from './shortlist-model';
import { fixtureResult, fixtureSet } from './test-fixtures';

const viewer = (id: number, role: Viewer['role']): Viewer => ({ id, role, permissions: ROLE_PERMISSIONS[role] });

describe('moveItem', () => {
  it('swaps an entry with its neighbour up or down', () => {
    expect(moveItem([1, 2, 3], 2, -1)).toEqual([1, 3, 2]);
    expect(moveItem([1, 2, 3], 0, 1)).toEqual([2, 1, 3]);
  });

  it('leaves the order as it is at either end', () => {
    expect(moveItem([1, 2, 3], 0, -1)).toEqual([1, 2, 3]);
    expect(moveItem([1, 2, 3], 2, 1)).toEqual([1, 2, 3]);
  });
});

describe('shortlistRights', () => {
  const open = { status: 'open' as const, author: { id: 7 }, items: [{}] };

  it('lets the author edit and submit an open shortlist with items, but not an empty one', () => {
    expect(shortlistRights(open, viewer(7, 'engineer'), [7, 8])).toMatchObject({ canEdit: true, canSubmit: true, decision: 'not-waiting' });
    expect(shortlistRights({ ...open, items: [] }, viewer(7, 'engineer'), [7]).canSubmit).toBe(false);
  });

  it('lets nobody else edit it, and the author not once it is submitted', () => {
    expect(shortlistRights(open, viewer(8, 'checker'), [7, 8]).canEdit).toBe(false);
    expect(shortlistRights({ ...open, status: 'submitted' }, viewer(7, 'engineer'), [7]).canEdit).toBe(false);
  });

  it('lets a checker who is a member decide a submitted shortlist, never its author', () => {
    const submitted = { ...open, status: 'submitted' as const };
    expect(shortlistRights(submitted, viewer(8, 'checker'), [7, 8]).decision).toBe('allowed');
    expect(shortlistRights(submitted, viewer(7, 'checker'), [7, 8]).decision).toBe('own-work');
    expect(shortlistRights(submitted, viewer(9, 'engineer'), [7, 9]).decision).toBe('no-role');
    expect(shortlistRights(submitted, viewer(10, 'checker'), [7, 8]).decision).toBe('not-member');
    // Admins may check in every project (server: admins see all projects).
    expect(shortlistRights(submitted, viewer(1, 'admin'), [7, 8]).decision).toBe('allowed');
  });
});

describe('comparisonRows', () => {
  const acrylic = { propertySet: fixtureSet(), result: fixtureResult() };
  const titanium = {
    propertySet: fixtureSet({ id: 20, tensileYield: 828e6, density: 4430, tensileStrength: 895e6 }),
    result: fixtureResult({ governingMode: 'buckling', margin: -0.2, requiredThickness: null, massPerArea: null, warnings: ['Elastic buckling only'] }),
  };

  it('gives one cell per candidate in SI units, and a yield row only when a candidate has a yield', () => {
    const rows = comparisonRows([acrylic], 'SI');
    expect(rows.find((r) => r.key === 'tensileYield')).toBeUndefined();
    const density = rows.find((r) => r.key === 'density')!;
    expect(density.label).toBe('Density');
    expect(density.unit).toBe('kg/m³');
    expect(density.cells.map((c) => c.text)).toEqual(['1,190']);
    const both = comparisonRows([acrylic, titanium], 'SI');
    expect(both.find((r) => r.key === 'tensileYield')!.cells.map((c) => c.text)).toEqual(['—', '828.0']);
  });

  it('shows the governing mode, margin and required thickness of each candidate', () => {
    const rows = comparisonRows([acrylic, titanium], 'SI');
    expect(rows.find((r) => r.key === 'governingMode')!.cells.map((c) => c.mode)).toEqual(['compression', 'buckling']);
    expect(rows.find((r) => r.key === 'margin')!.cells.map((c) => c.text)).toEqual(['+15 %', '-20 %']);
    expect(rows.find((r) => r.key === 'requiredThickness')!.cells.map((c) => c.text)).toEqual(['87.0', 'none suffices']);
    expect(rows.find((r) => r.key === 'warnings')!.cells[1].warnings).toEqual(['Elastic buckling only']);
  });

  it('follows the unit toggle: US customary labels and values', () => {
    const rows = comparisonRows([acrylic], 'US');
    const strength = rows.find((r) => r.key === 'tensileStrength')!;
    // 62 MPa = 8.99 ksi (1 psi = 6894.757 Pa, NIST SP 811).
    expect(strength.unit).toBe('ksi');
    expect(strength.cells[0].text).toBe('8.99');
    expect(rows.find((r) => r.key === 'requiredThickness')!.unit).toBe('in');
    expect(rows.find((r) => r.key === 'safetyFactor')!.unit).toBeUndefined();
  });

  it('shows a dash for results that are missing', () => {
    const rows = comparisonRows([{ propertySet: fixtureSet(), result: null }], 'SI');
    expect(rows.find((r) => r.key === 'safetyFactor')!.cells[0].text).toBe('—');
  });
});
