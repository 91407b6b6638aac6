/**
 * Catalogue candidates are named "Material (condition)", and a material's own name may hold
 * brackets too ("Sapphire (single-crystal alumina) (Optical-grade …)"). The condition is the
 * last bracketed group, found by matching the final ")" back to its own "(".
 */
export function splitCandidateName(name: string): { material: string; condition: string } {
  if (!name.endsWith(')')) return { material: name, condition: '' };
  let depth = 0;
  for (let i = name.length - 1; i >= 0; i--) {
    if (name[i] === ')') depth++;
    else if (name[i] === '(' && --depth === 0) {
      const material = name.slice(0, i).trimEnd();
      return material ? { material, condition: name.slice(i + 1, -1) } : { material: name, condition: '' };
    }
  }
  return { material: name, condition: '' };
}
