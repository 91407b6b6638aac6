/**
 * The query keys of one kind of data, from its root: `all` (the prefix of everything of that kind,
 * for invalidating it), `lists()` (every list), `list(filters)` (one list, by what it is filtered
 * by) and `detail(id)`. A feature's factory spreads them and adds its own keys under `all`.
 */
export function queryKeys<Filters = never>(root: string) {
  const all = [root] as const;
  const lists = () => [...all, 'list'] as const;
  return {
    all,
    lists,
    list: (filters: Filters) => [...lists(), filters] as const,
    detail: (id: number) => [...all, 'detail', id] as const,
  };
}
