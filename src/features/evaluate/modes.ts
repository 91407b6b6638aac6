// The failure-mode labels and colours are shared with the projects pages (design records).
export { MODE_COLOURS, MODE_LABELS } from '@/components/failure-modes';
