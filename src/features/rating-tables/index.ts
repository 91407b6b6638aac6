// The public module of the rating-tables feature: what other features may use. Everything else
// in this folder is its own business (the lint refuses deep imports from another feature).
export { useRatingTables } from './api/rating-tables';
export { RatingTableSummary } from './components/rating-table-summary';
