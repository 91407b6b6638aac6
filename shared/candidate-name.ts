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

const words = (text: string) => text.split(/\s+/).filter(Boolean);

/** The first clause of a condition ("PVHO-grade cast sheet, typical values …" → "PVHO-grade cast sheet"). */
function firstClause(condition: string): string {
  return condition.split(/[,;(]/)[0].trim();
}

/** Closes what a cut left open, so a short label never reads "(PVHO-grade cast she…". */
function balanced(text: string): string {
  let open = 0;
  for (const ch of text) {
    if (ch === '(') open++;
    else if (ch === ')' && open > 0) open--;
  }
  return text + ')'.repeat(open);
}

/**
 * Short labels for charts, distinct within the list: the material's designation and a short name of
 * its condition ("Cast acrylic (PMMA) · PVHO-grade cast sheet"). Where two would read the same, more
 * of the condition is taken, word by word; if they still match, the property set's number is added.
 */
export function shortCandidateLabels(candidates: readonly { name: string; propertySetId?: number }[], maxWords = 4): string[] {
  const parts = candidates.map((c) => splitCandidateName(c.name));
  const label = (i: number, n: number | null) => {
    const { material, condition } = parts[i];
    if (!condition) return material;
    const all = words(condition);
    const clause = words(firstClause(condition));
    const taken = n === null ? clause.slice(0, maxWords) : all.slice(0, n);
    const cut = n === null ? clause.length > maxWords || clause.length < all.length : n < all.length;
    return `${material} · ${balanced(taken.join(' ').replace(/[,;:]$/, ''))}${cut ? '…' : ''}`;
  };
  const out = candidates.map((_, i) => label(i, null));
  const lengths = candidates.map(() => 0);
  for (let round = 0; round < 40; round++) {
    const groups = new Map<string, number[]>();
    out.forEach((l, i) => groups.set(l, [...(groups.get(l) ?? []), i]));
    const clashes = [...groups.values()].filter((g) => g.length > 1);
    if (!clashes.length) return out;
    let grew = false;
    for (const group of clashes) {
      for (const i of group) {
        const total = words(parts[i].condition).length;
        const next = Math.max(lengths[i], words(firstClause(parts[i].condition)).length) + 1;
        if (next <= total) {
          lengths[i] = next;
          out[i] = label(i, next);
          grew = true;
        }
      }
    }
    if (!grew) break;
  }
  const seen = new Map<string, number>();
  out.forEach((l) => seen.set(l, (seen.get(l) ?? 0) + 1));
  return out.map((l, i) => ((seen.get(l) ?? 0) > 1 ? `${l} #${candidates[i].propertySetId ?? i + 1}` : l));
}
