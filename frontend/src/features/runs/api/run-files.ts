import { api } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';

export type RunFileKind = 'csv' | 'xlsx' | 'pdf' | 'report';

const PATHS: Record<RunFileKind, (runId: string) => string> = {
  csv: (id) => `/runs/${encodeURIComponent(id)}/export?format=csv`,
  xlsx: (id) => `/runs/${encodeURIComponent(id)}/export?format=xlsx`,
  pdf: (id) => `/runs/${encodeURIComponent(id)}/sheet`,
  report: (id) => `/runs/${encodeURIComponent(id)}/report`,
};

const EXTENSIONS: Record<RunFileKind, string> = { csv: 'csv', xlsx: 'xlsx', pdf: 'pdf', report: 'results-report.pdf' };

/** Fetches an export of a saved run with the session token and hands it to the browser as a download. */
export async function downloadRunFile(runId: string, kind: RunFileKind, fileStem: string): Promise<void> {
  saveFile(await api.download(PATHS[kind](runId)), `${fileStem}.${EXTENSIONS[kind]}`);
}
