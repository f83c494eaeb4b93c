import { api } from '@/lib/api-client';

export type RunFileKind = 'csv' | 'xlsx' | 'pdf';

const PATHS: Record<RunFileKind, (runId: string) => string> = {
  csv: (id) => `/runs/${encodeURIComponent(id)}/export?format=csv`,
  xlsx: (id) => `/runs/${encodeURIComponent(id)}/export?format=xlsx`,
  pdf: (id) => `/runs/${encodeURIComponent(id)}/sheet`,
};

/** Fetches an export of a saved run with the session token and hands it to the browser as a download. */
export async function downloadRunFile(runId: string, kind: RunFileKind, fileStem: string): Promise<void> {
  const blob = await api.download(PATHS[kind](runId));
  const url = URL.createObjectURL(blob);
  const link = Object.assign(document.createElement('a'), { href: url, download: `${fileStem}.${kind}` });
  document.body.append(link);
  link.click();
  link.remove();
  URL.revokeObjectURL(url);
}
