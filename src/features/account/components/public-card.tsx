import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Logo } from '@/components/logo';

/** The frame of the pages reached from an e-mail link or the sign-in page, outside the app. */
export function PublicCard({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-trench px-4">
      <div className="w-full max-w-sm rounded-plate bg-chart-raised p-6 shadow-plate">
        <div className="mb-5 flex items-center gap-3">
          <Logo className="h-9 w-9" />
          <div>
            <p className="text-xl font-bold">Isobath</p>
            <h1 className="text-sm text-ink-soft">{title}</h1>
          </div>
        </div>
        {children}
        <p className="mt-5 border-t border-chart-line pt-3 text-xs">
          <Link to="/sign-in" className="font-bold text-sounding underline">
            Back to sign-in
          </Link>
        </p>
      </div>
    </main>
  );
}
