import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { ApiError } from '@/lib/api-client';

export function NotFoundPage() {
  return (
    <div className="py-16 text-center">
      <h1 className="text-2xl font-bold">Nothing charted here</h1>
      <p className="mt-2 text-ink-soft">The page you asked for does not exist or you cannot see it.</p>
      <Link to="/catalogue" className="mt-4 inline-block font-bold text-sounding underline">
        Back to the catalogue
      </Link>
    </div>
  );
}

export function RouteError() {
  const error = useRouteError();
  if ((isRouteErrorResponse(error) && error.status === 404) || (error instanceof ApiError && error.status === 404)) return <NotFoundPage />;
  const message = error instanceof ApiError ? error.message : 'An unexpected error stopped this page.';
  const refused = error instanceof ApiError && error.status === 403;
  return (
    <div role="alert" className="mx-auto max-w-xl py-16 text-center" data-testid={refused ? 'page-refused' : 'page-error'}>
      <h1 className="text-2xl font-bold">{refused ? 'Your role cannot use this page' : 'This page could not be shown'}</h1>
      <p className="mt-2 text-ink-soft">{message}</p>
      <a href="/catalogue" className="mt-4 inline-block font-bold text-sounding underline">
        Reload the catalogue
      </a>
    </div>
  );
}
