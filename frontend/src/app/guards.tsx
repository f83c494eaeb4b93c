import { hasAnyRole, type Role } from '@meritline/shared';
import { Outlet } from 'react-router';
import { NotAllowed } from '@/components/not-allowed';
import { useSession } from '@/lib/auth';

/** Shows its child routes only to users holding at least one of `roles`. */
export function RequireRole({ roles }: { roles: readonly Role[] }) {
  const { user } = useSession();
  if (!user || !hasAnyRole(user.roles, roles)) return <NotAllowed requiredRoles={roles} userRoles={user?.roles ?? []} />;
  return <Outlet />;
}
