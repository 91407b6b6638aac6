import { NavLink, Outlet } from 'react-router-dom';
import type { Permission, SessionUserDto } from '@shared/schemas/auth';
import { ROLE_LABELS } from '@shared/roles';
import { useUnits } from '@/lib/unit-system';
import { Logo } from './logo';

/**
 * Main sections, each shown only to roles that may use it (the server checks again); a section
 * without a permission is for every signed-in account.
 */
export const SECTIONS: { to: string; label: string; permission?: Permission }[] = [
  { to: '/catalogue', label: 'Catalogue', permission: 'catalogue:read' },
  { to: '/evaluate', label: 'Evaluate', permission: 'evaluate' },
  { to: '/projects', label: 'Projects', permission: 'project:read' },
  { to: '/library', label: 'Library desk', permission: 'catalogue:draft' },
  { to: '/admin', label: 'Admin', permission: 'audit:read' },
  { to: '/api-docs', label: 'API' },
];

function UnitSwitch() {
  const { system, setSystem } = useUnits();
  return (
    <div role="radiogroup" aria-label="Units" className="flex overflow-hidden rounded-plate border border-white/20 text-xs">
      {(['SI', 'US'] as const).map((s) => (
        <button
          key={s}
          type="button"
          role="radio"
          aria-checked={system === s}
          onClick={() => setSystem(s)}
          className={`px-2 py-1 font-bold ${system === s ? 'bg-brass text-white' : 'text-white/70 hover:text-white'}`}
          title={s === 'SI' ? 'SI units (MPa, mm, °C)' : 'US customary units (psi, in, °F)'}
        >
          {s}
        </button>
      ))}
    </div>
  );
}

/**
 * The frame of every signed-in page. The account and the sign-out come from the app (src/app),
 * which owns the session, so this shared piece knows no feature.
 */
export function AppShell({ me, onSignOut }: { me: SessionUserDto | null | undefined; onSignOut: () => void }) {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-white focus:p-2">
        Skip to content
      </a>
      <header className="no-print bg-trench text-white">
        <div className="mx-auto flex max-w-screen-2xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <NavLink to="/catalogue" className="flex items-center gap-2 font-bold tracking-wide">
            <Logo className="h-7 w-7" />
            Isobath
          </NavLink>
          <nav aria-label="Sections" className="flex flex-wrap gap-1">
            {SECTIONS.filter((s) => me && (!s.permission || me.permissions.includes(s.permission))).map((s) => (
              <NavLink
                key={s.to}
                to={s.to}
                className={({ isActive }) => `rounded-plate px-3 py-1.5 text-sm ${isActive ? 'bg-white/15 font-bold' : 'text-white/80 hover:text-white'}`}
              >
                {s.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-4">
            <UnitSwitch />
            {me ? (
              <NavLink
                to="/account"
                className="text-sm text-white/80 hover:text-white hover:underline"
                data-testid="signed-in-as"
                title="Your account: change your password"
              >
                {me.name} · {ROLE_LABELS[me.role]}
              </NavLink>
            ) : null}
            <button
              type="button"
              className="text-sm text-white/80 underline hover:text-white"
              onClick={onSignOut}
            >
              Sign out
            </button>
          </div>
        </div>
      </header>
      <main id="main" className="print-full mx-auto w-full max-w-screen-2xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      <footer className="no-print border-t border-chart-line py-3 text-center text-xs text-ink-faint">
        Isobath · screening estimates for qualified engineers; defer to the applicable standards and licensed practice.
      </footer>
    </div>
  );
}
