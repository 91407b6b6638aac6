import { describe, expect, it } from 'vitest';
import { splitCandidateName } from './candidate-name';

describe('splitCandidateName', () => {
  it('takes the last bracketed group as the condition, keeping brackets in the material name', () => {
    expect(splitCandidateName('Sapphire (single-crystal alumina) (Optical-grade single crystal, polished window)')).toEqual({
      material: 'Sapphire (single-crystal alumina)',
      condition: 'Optical-grade single crystal, polished window',
    });
  });

  it('keeps brackets inside the condition', () => {
    expect(splitCandidateName('Soda-lime silicate glass (float) (Chemically strengthened (ion-exchanged) float)')).toEqual({
      material: 'Soda-lime silicate glass (float)',
      condition: 'Chemically strengthened (ion-exchanged) float',
    });
    expect(splitCandidateName('Cast acrylic (PMMA) (Cast sheet, as supplied)').material).toBe('Cast acrylic (PMMA)');
  });

  it('leaves a name without a condition whole', () => {
    expect(splitCandidateName('Harrow trial resin')).toEqual({ material: 'Harrow trial resin', condition: '' });
    expect(splitCandidateName('(unbalanced')).toEqual({ material: '(unbalanced', condition: '' });
    expect(splitCandidateName('(only a condition)')).toEqual({ material: '(only a condition)', condition: '' });
  });
});
