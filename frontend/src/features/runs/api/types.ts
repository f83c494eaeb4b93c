import type { RunStatus } from '@meritline/shared';

/** The run shapes of the API come from the shared contract (`@meritline/shared`); only the list filters are the screen's own. */
export interface RunFilters {
  methodId?: string;
  methodVersionId?: string;
  status?: RunStatus;
  cursor?: string;
  pageSize?: number;
}
