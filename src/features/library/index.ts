// The public module of the library feature: what other features may use. Everything else in
// this folder is its own business (the lint refuses deep imports from another feature).
export { materialsQueryOptions } from './api/library-sets';
export { referencesQueryOptions } from './api/references';
