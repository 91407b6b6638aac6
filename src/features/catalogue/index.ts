// The public module of the catalogue feature: what other features may use. Everything else in
// this folder is its own business (the lint refuses deep imports from another feature).
export { materialQueryOptions } from './api/property-sets';
