import type { Role } from '@shared/domain/vocabulary';
import { useCurrentUser } from '../api/get-current-user';

export type RoleAccess = 'checking' | 'failed' | 'signed-out' | 'not-allowed' | 'allowed';

/** Whether the person on this browser may see a page for `allowed` roles. The server decides for real. */
export function useRoleAccess(allowed: readonly Role[]) {
  const userQuery = useCurrentUser();
  const user = userQuery.data;
  let access: RoleAccess;
  if (user === undefined) access = userQuery.isError ? 'failed' : 'checking';
  else if (user === null) access = 'signed-out';
  else access = allowed.includes(user.role) ? 'allowed' : 'not-allowed';
  return { access, user, retry: () => void userQuery.refetch(), error: userQuery.error };
}
