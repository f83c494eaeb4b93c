import type { MethodVersionStatus, MethodVersionDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { versionBody, type VersionFormValues } from './create-version';
import { methodsQueries } from './methods-queries';

/** Edits a draft version's criteria and settings; the server answers 409 when someone saved first or the version is no longer a draft. */
export function useUpdateVersion(version: Pick<MethodVersionDto, 'id' | 'lockVersion'>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (values: VersionFormValues) =>
      api.patch<MethodVersionDto>(`/method-versions/${encodeURIComponent(version.id)}`, {
        lockVersion: version.lockVersion,
        ...versionBody(values),
      }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: methodsQueries.all }),
    meta: { inlineErrors: true },
  });
}

/** A quality manager's activation without a covering study: a written reason signed with the re-entered password. */
export interface ActivationSignature {
  activationJustification: string;
  password: string;
}

export function useChangeVersionStatus(version: Pick<MethodVersionDto, 'id' | 'lockVersion'>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ status, signature }: { status: MethodVersionStatus; signature?: ActivationSignature }) =>
      api.patch<MethodVersionDto>(
        `/method-versions/${encodeURIComponent(version.id)}`,
        {
          lockVersion: version.lockVersion,
          status,
          ...signature,
        },
        signature ? { passwordCheck: true } : undefined,
      ),
    onSettled: () => queryClient.invalidateQueries({ queryKey: methodsQueries.all }),
  });
}
