import { hasAnyRole, Role } from '@meritline/shared';
import { useSession } from '@/lib/auth';

/** Quality managers and administrators decide on methods; analysts may propose drafts. */
export function useMethodPermissions() {
  const { user } = useSession();
  const roles = user?.roles ?? [];
  const canManage = hasAnyRole(roles, [Role.QualityManager, Role.Admin]);
  const canPropose = canManage || hasAnyRole(roles, [Role.Analyst]);
  /** Analysts may still edit the drafts they proposed themselves. */
  const canEditDraft = (createdById: string) => canManage || (canPropose && createdById === user?.id);
  return { canManage, canPropose, canEditDraft };
}
