// One date format everywhere (shared/dates.ts), so the record's PDF and the pages agree.
export { formatDate, formatDateTime } from '@shared/dates';
