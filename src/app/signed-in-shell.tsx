import { useNavigate } from 'react-router-dom';
import { AppShell } from '@/components/app-shell';
import { useMe, useSignOut } from '@/features/auth/api/session';

/** The app shell with the signed-in account; signing out always lands on the sign-in page. */
export function SignedInShell() {
  const { data: me } = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  return <AppShell me={me} onSignOut={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })} />;
}
