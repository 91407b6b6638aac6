import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { invitationsQueryOptions, usersQueryOptions } from '@/features/admin/api/users';
import { TeamPage } from '@/features/admin/components/team-page';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('users:manage');
  void queryClient.prefetchQuery(usersQueryOptions());
  void queryClient.prefetchQuery(invitationsQueryOptions());
  return null;
}

export function Component() {
  return <TeamPage meId={useMe().data?.id ?? 0} />;
}
