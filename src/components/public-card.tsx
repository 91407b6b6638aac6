import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Logo } from '@/components/logo';

/**
 * The frame of the pages outside the app: the sign-in page (no title: the product's name is the
 * heading) and the pages reached from it or from an e-mail link (with a way back to sign-in).
 */
export function PublicCard({ title, children }: { title?: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-trench px-4">
      <div className="w-full max-w-sm rounded-plate bg-chart-raised p-6 shadow-plate">
        <div className="mb-5 flex items-center gap-3">
          <Logo className="h-9 w-9" />
          {title ? (
            <div>
              <p className="text-xl font-bold">Isobath</p>
              <h1 className="text-sm text-ink-soft">{title}</h1>
            </div>
          ) : (
            <div>
              <h1 className="text-xl font-bold">Isobath</h1>
              <p className="text-xs text-ink-soft">Windows and hulls for deep water, with their sources</p>
            </div>
          )}
        </div>
        {children}
        {title ? (
          <p className="mt-5 border-t border-chart-line pt-3 text-xs">
          <Link to="/sign-in" className="font-bold text-sounding underline">
            Back to sign-in
            </Link>
          </p>
        ) : null}
      </div>
    </main>
  );
}
