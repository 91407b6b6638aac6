import { useNavigate } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { authKeys } from '@/features/auth/api/session';
import { WelcomePage } from '@/features/account/components/welcome-page';

// Accepting an invitation signs the new account in: start its session afresh, then the catalogue.
export function Component() {
  const navigate = useNavigate();
  return (
    <WelcomePage
      onSignedIn={(user) => {
        queryClient.clear();
        queryClient.setQueryData(authKeys.me(), user);
        navigate('/catalogue', { replace: true });
      }}
    />
  );
}
