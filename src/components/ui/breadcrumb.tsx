import { Link } from 'react-router-dom';

/** Where a page sits: the links back up, then the page itself (not printed). */
export function Breadcrumb({ trail }: { trail: { to?: string; label: string }[] }) {
  return (
    <nav aria-label="Breadcrumb" className="no-print text-sm">
      {trail.map((t, i) => (
        <span key={`${t.label}-${i}`}>
          {i > 0 ? <span className="px-1 text-ink-faint">/</span> : null}
          {t.to ? (
            <Link to={t.to} className="text-sounding hover:underline">
              {t.label}
            </Link>
          ) : (
            <span className="text-ink-soft">{t.label}</span>
          )}
        </span>
      ))}
    </nav>
  );
}
