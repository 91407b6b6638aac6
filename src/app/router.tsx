import { createBrowserRouter, Navigate, redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/session';
import { SignInPage } from '@/features/auth/components/sign-in-page';
import { AppShell } from '@/components/app-shell';
import { RouteError, NotFoundPage } from './route-error';

/** Every page below the shell needs a session; without one, go to sign-in and come back. */
async function requireSession({ request }: LoaderFunctionArgs) {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (!me) {
    const url = new URL(request.url);
    throw redirect(`/sign-in?next=${encodeURIComponent(url.pathname + url.search)}`);
  }
  return null;
}

async function redirectIfSignedIn() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me) throw redirect('/catalogue');
  return null;
}

export const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInPage />, loader: redirectIfSignedIn, errorElement: <RouteError /> },
  {
    path: '/',
    element: <AppShell />,
    loader: requireSession,
    errorElement: <RouteError />,
    children: [
      { index: true, element: <Navigate to="/catalogue" replace /> },
      { path: 'catalogue', lazy: () => import('./routes/catalogue') },
      { path: 'materials/:id', lazy: () => import('./routes/material') },
      { path: 'sets/:id', lazy: () => import('./routes/set-redirect') },
      { path: 'evaluate', lazy: () => import('./routes/evaluate') },
      { path: 'library', lazy: () => import('./routes/library') },
      { path: 'library/sets/new', lazy: () => import('./routes/library-set-new') },
      { path: 'library/sets/:id', lazy: () => import('./routes/library-set') },
      { path: 'library/import', lazy: () => import('./routes/library-import') },
      { path: 'library/references', lazy: () => import('./routes/library-references') },
      { path: 'admin', element: <Navigate to="/admin/audit" replace /> },
      { path: 'admin/audit', lazy: () => import('./routes/admin-audit') },
      { path: 'admin/mail', lazy: () => import('./routes/admin-mail') },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
