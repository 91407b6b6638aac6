import { createBrowserRouter, Navigate, redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/session';
import { SignedInShell } from './signed-in-shell';
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

export const router = createBrowserRouter([
  // Lazy like every page: the form library and its schemas stay out of the first chunk.
  { path: '/sign-in', lazy: () => import('./routes/sign-in'), errorElement: <RouteError /> },
  // Reached from e-mail links or the sign-in page, without a session.
  { path: '/welcome', lazy: () => import('./routes/welcome'), errorElement: <RouteError /> },
  { path: '/forgot-password', lazy: () => import('./routes/forgot-password'), errorElement: <RouteError /> },
  { path: '/reset-password', lazy: () => import('./routes/reset-password'), errorElement: <RouteError /> },
  {
    path: '/',
    element: <SignedInShell />,
    loader: requireSession,
    errorElement: <RouteError />,
    children: [
      {
        // A page's refusal or failure shows inside the shell, under the app's header.
        errorElement: <RouteError />,
        children: [
          { index: true, lazy: () => import('./routes/home') },
          { path: 'catalogue', lazy: () => import('./routes/catalogue') },
          { path: 'materials/:id', lazy: () => import('./routes/material') },
          { path: 'sets/:id', lazy: () => import('./routes/set-redirect') },
          { path: 'evaluate', lazy: () => import('./routes/evaluate') },
          { path: 'library', lazy: () => import('./routes/library') },
          { path: 'library/sets/new', lazy: () => import('./routes/library-set-new') },
          { path: 'library/sets/:id', lazy: () => import('./routes/library-set') },
          { path: 'library/import', lazy: () => import('./routes/library-import') },
          { path: 'library/references', lazy: () => import('./routes/library-references') },
          { path: 'library/references/:id', lazy: () => import('./routes/library-reference') },
          { path: 'library/rating-tables', lazy: () => import('./routes/library-rating-tables') },
          { path: 'library/rating-tables/new', lazy: () => import('./routes/library-rating-table-new') },
          { path: 'library/rating-tables/:id', lazy: () => import('./routes/library-rating-table') },
          { path: 'projects', lazy: () => import('./routes/projects') },
          { path: 'projects/:id', lazy: () => import('./routes/project') },
          { path: 'shortlists/:id', lazy: () => import('./routes/shortlist') },
          { path: 'records/:id', lazy: () => import('./routes/record') },
          { path: 'account', lazy: () => import('./routes/account') },
          { path: 'api-docs', lazy: () => import('./routes/api-docs') },
          { path: 'admin', element: <Navigate to="/admin/audit" replace /> },
          { path: 'admin/users', lazy: () => import('./routes/admin-users') },
          { path: 'admin/audit', lazy: () => import('./routes/admin-audit') },
          { path: 'admin/mail', lazy: () => import('./routes/admin-mail') },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
]);
