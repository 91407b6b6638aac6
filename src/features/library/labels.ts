import type { ValueBasis, PropertySetStatus } from '@shared/schemas/catalogue';

export { REFERENCE_KIND_LABELS } from '@shared/schemas/catalogue';

export const BASIS_LABELS: Record<ValueBasis, string> = {
  minimum: 'Minimum',
  typical: 'Typical',
  'statistical-allowable': 'Statistical allowable',
};

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

const dateTime = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium' });

export const formatDateTime = (iso: string | null | undefined) => (iso ? dateTime.format(new Date(iso)) : '—');
export const formatDate = (iso: string | null | undefined) => (iso ? dateOnly.format(new Date(iso)) : '—');

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(0)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
