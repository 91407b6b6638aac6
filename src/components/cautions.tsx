import { CAUTIONS_TEXT } from '@shared/cautions';

export function Cautions({ compact = false }: { compact?: boolean }) {
  return (
    <aside aria-label="Cautions" className={`rounded-plate border-l-4 border-brass bg-brass-light/60 text-sm text-ink ${compact ? 'px-3 py-2' : 'px-4 py-3'}`}>
      <strong className="mr-1">Caution.</strong>
      {CAUTIONS_TEXT}
    </aside>
  );
}
