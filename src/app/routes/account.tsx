import { useMe } from '@/features/auth/api/session';
import { AccountPage } from '@/features/account/components/account-page';

export function Component() {
  const me = useMe().data;
  return me ? <AccountPage me={me} /> : null;
}
