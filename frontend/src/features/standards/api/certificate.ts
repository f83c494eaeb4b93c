import { MAX_CERTIFICATE_BYTES, type ReferenceMaterialDto } from '@meritline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';
import { referenceMaterialsQueries } from './reference-materials-queries';

export const MAX_CERTIFICATE_MB = MAX_CERTIFICATE_BYTES / 1024 / 1024;

export function useUploadCertificate() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ material, file }: { material: ReferenceMaterialDto; file: File }) => {
      const form = new FormData();
      form.append('lockVersion', String(material.lockVersion));
      form.append('file', file);
      return api.put<ReferenceMaterialDto>(`/reference-materials/${encodeURIComponent(material.id)}/certificate`, form);
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: referenceMaterialsQueries.all }),
  });
}

export async function downloadCertificate(material: ReferenceMaterialDto) {
  const blob = await api.download(`/reference-materials/${encodeURIComponent(material.id)}/certificate`);
  saveFile(blob, material.certificate?.fileName ?? 'certificate.pdf');
}
