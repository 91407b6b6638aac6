/** The positive whole-number id in a route parameter, or a 404 for anything else. */
export function routeId(raw: string | undefined): number {
  const id = raw && /^[1-9]\d{0,9}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(id) || id > 2_147_483_647) throw new Response('Not found', { status: 404 });
  return id;
}
