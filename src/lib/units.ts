// The units table lives in shared/units.ts so the server (CSV import) and the client convert
// through the same definitions; the client's modules keep importing it from here.
export * from '@shared/units';
