import { redirect } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions } from '@/features/auth/api/session';
import { SignInPage } from '@/features/auth/components/sign-in-page';

/** Someone already signed in goes straight to the catalogue. */
export async function loader() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me) throw redirect('/catalogue');
  return null;
}

export const Component = SignInPage;
