// The failure-mode colours are shared with the projects pages (design records); their words are
// FAILURE_MODE_LABELS in shared/labels.ts.
export { MODE_COLOURS } from '@/components/failure-modes';
