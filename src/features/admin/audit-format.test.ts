import { describe, expect, it } from 'vitest';
import { changedKeys, entityHref, entityLabel, formatState } from './audit-format';

describe('audit log formatting', () => {
  it('lists the top-level fields that changed, in order', () => {
    expect(changedKeys({ status: 'in-review', lockVersion: 3, condition: 'annealed' }, { status: 'published', lockVersion: 4, condition: 'annealed' })).toEqual([
      'lockVersion',
      'status',
    ]);
    expect(changedKeys(null, { status: 'draft' })).toEqual([]);
    expect(changedKeys({ a: [1, 2] }, { a: [1, 2], b: null })).toEqual(['b']);
  });

  it('says “nothing” for a missing side and indents the rest', () => {
    expect(formatState(null)).toBe('nothing');
    expect(formatState({ a: 1 })).toBe('{\n  "a": 1\n}');
  });

  it('links property sets and materials, and names entity types', () => {
    expect(entityHref('property-set', '12')).toBe('/library/sets/12');
    expect(entityHref('import', '3')).toBeNull();
    expect(entityHref('reference', '7')).toBe('/library/references/7');
    expect(entityHref('rating-table', '4')).toBe('/library/rating-tables/4');
    expect(entityHref('shortlist', '9')).toBe('/shortlists/9');
    expect(entityHref('project', '2')).toBe('/projects/2');
    expect(entityLabel('reference-version')).toBe('Reference change');
    expect(entityHref('material', null)).toBeNull();
    expect(entityLabel('import')).toBe('CSV import');
    expect(entityLabel('value-confirmation')).toBe('Value confirmation');
    expect(entityLabel('rating-table')).toBe('Rating table');
    expect(entityLabel('load-case')).toBe('Load case');
    expect(entityLabel('widget')).toBe('widget');
  });
});
