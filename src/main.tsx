import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import '@fontsource/lato/400.css';
import '@fontsource/lato/700.css';
import './styles/index.css';
import { AppProviders } from './app/providers';
import { router } from './app/router';
import { queryClient } from './lib/query-client';
import { setUnauthenticatedHandler } from './lib/api-client';
import { authKeys } from './features/auth/api/session';

// A session that ends elsewhere (sign-out in another tab, account deactivated) sends the
// user back to sign-in instead of leaving broken pages.
setUnauthenticatedHandler(() => {
  queryClient.setQueryData(authKeys.me(), null);
  const here = window.location.pathname + window.location.search;
  if (!here.startsWith('/sign-in')) void router.navigate(`/sign-in?next=${encodeURIComponent(here)}`);
});

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProviders>
      <RouterProvider router={router} />
    </AppProviders>
  </StrictMode>,
);
