import type { PropertySetStatus } from '@shared/schemas/catalogue';
import type { ConfirmationStatus } from '@shared/workflows/confirmation';

// Words the record and its PDF use too live in shared/labels.ts.
export { REFERENCE_KIND_LABELS, VALUE_BASIS_LABELS } from '@shared/labels';

export const STATUS_LABELS: Record<PropertySetStatus, string> = {
  draft: 'draft',
  'in-review': 'in review',
  published: 'published',
  retired: 'retired',
};

export const STATUS_TONE: Record<PropertySetStatus, 'neutral' | 'sounding' | 'brass' | 'pass'> = {
  draft: 'brass',
  'in-review': 'sounding',
  published: 'pass',
  retired: 'neutral',
};

export { formatDate, formatDateTime } from '@/lib/dates';

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(0)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/** A value confirmation's status, in the desk's words. */
export const CONFIRMATION_STATUS_LABELS: Record<ConfirmationStatus, string> = {
  proposed: 'proposed',
  approved: 'approved',
  rejected: 'rejected',
};

export const CONFIRMATION_STATUS_TONE: Record<ConfirmationStatus, 'sounding' | 'pass' | 'fail'> = {
  proposed: 'sounding',
  approved: 'pass',
  rejected: 'fail',
};
