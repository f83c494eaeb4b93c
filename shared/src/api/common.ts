export interface FieldError {
  field: string;
  code: string;
  message: string;
}

/** Body of every 4xx answer; `errors` is present on 422 (and 400 for malformed input). */
export interface ApiErrorBody {
  statusCode: number;
  message: string;
  errors?: FieldError[];
}

/** A person named on a record. */
export interface UserRef {
  id: string;
  name: string;
}

/** Matching rows are counted up to this many; beyond it a list says "more than" instead of walking the whole table. */
export const LIST_COUNT_CAP = 1000;

/**
 * One page of a list paged by cursor (keyset): pass `nextCursor` or `prevCursor` back as `cursor` for the
 * neighbouring page. A cursor belongs to the sort and order it was made with.
 */
export interface KeysetPage<T> {
  items: T[];
  /** null on the last page. */
  nextCursor: string | null;
  /** null on the first page. */
  prevCursor: string | null;
  /** Matching rows, counted up to LIST_COUNT_CAP; when `totalIsCapped`, at least this many. */
  total: number;
  totalIsCapped: boolean;
  pageSize: number;
}
