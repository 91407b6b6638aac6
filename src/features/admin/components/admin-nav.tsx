import { NavLink } from 'react-router-dom';

/** The admin pages this build has; each route checks its own permission. */
export function AdminNav() {
  const link = ({ isActive }: { isActive: boolean }) =>
    `border-b-2 px-3 py-1.5 text-sm ${isActive ? 'border-sounding font-bold text-ink' : 'border-transparent text-ink-soft hover:text-ink'}`;
  return (
    <nav aria-label="Admin" className="no-print flex gap-1 border-b border-chart-line">
      <NavLink to="/admin/users" className={link}>
        Team
      </NavLink>
      <NavLink to="/admin/audit" className={link}>
        Audit log
      </NavLink>
      <NavLink to="/admin/mail" className={link}>
        Mail
      </NavLink>
    </nav>
  );
}
