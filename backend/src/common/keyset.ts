import { applyDecorators } from '@nestjs/common';
import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import { LIST_COUNT_CAP } from '@meritline/shared';
import type { ObjectLiteral, SelectQueryBuilder } from 'typeorm';
import { unprocessable } from './validation.js';

export type KeysetDirection = 'after' | 'before';

/** The row a page starts after (or ends before), with the sort it was made for. */
export interface KeysetCursor {
  id: string;
  dir: KeysetDirection;
  sort: string;
  order: 'asc' | 'desc';
}

export const MAX_CURSOR_LENGTH = 400;

/** The `cursor` query parameter of a keyset-paged list. */
export const CursorParam = (description: string) =>
  applyDecorators(
    ApiPropertyOptional({ description }),
    IsOptional(),
    IsString(),
    MaxLength(MAX_CURSOR_LENGTH, { message: 'The page cursor is too long; start again from the first page.' }),
  );

/** The `pageSize` query parameter of a keyset-paged list: 1 to 100 rows. */
export const PageSizeParam = (defaultSize: number) =>
  applyDecorators(
    ApiPropertyOptional({ default: defaultSize, minimum: 1, maximum: 100 }),
    IsOptional(),
    Type(() => Number),
    IsInt(),
    Min(1),
    Max(100),
  );

export function encodeCursor(cursor: KeysetCursor): string {
  return Buffer.from(JSON.stringify([cursor.id, cursor.dir, cursor.sort, cursor.order])).toString('base64url');
}

const badCursor = (message: string) => unprocessable([{ field: 'cursor', code: 'invalid', message }]);

/** Refused with 422 on the field `cursor` when it cannot be read or was made for another sort. */
export function decodeCursor(text: string | undefined, sort: string | readonly string[], order: 'asc' | 'desc'): KeysetCursor | null {
  if (text === undefined || text === '') return null;
  let parts: unknown;
  try {
    parts = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch {
    throw badCursor('The page cursor cannot be read; start again from the first page.');
  }
  if (
    !Array.isArray(parts) ||
    parts.length !== 4 ||
    typeof parts[0] !== 'string' ||
    !/^[0-9a-f-]{36}$/i.test(parts[0]) ||
    (parts[1] !== 'after' && parts[1] !== 'before')
  ) {
    throw badCursor('The page cursor cannot be read; start again from the first page.');
  }
  const sorts: readonly unknown[] = typeof sort === 'string' ? [sort] : sort;
  if (!sorts.includes(parts[2]) || parts[3] !== order) {
    throw badCursor('The page cursor belongs to another sort order; start again from the first page.');
  }
  return { id: parts[0], dir: parts[1], sort: parts[2] as string, order };
}

export interface KeysetOptions<E> {
  alias: string;
  sortProperty: keyof E & string;
  sort: string;
  order: 'asc' | 'desc';
  cursor: KeysetCursor | null;
  pageSize: number;
  /**
   * The rows to count: the same filters on the main table alone, so the count reads no joined rows (SQLite
   * would otherwise walk every row's overflow pages to reach the join columns). null: no count.
   */
  countQuery: SelectQueryBuilder<ObjectLiteral> | null;
}

export interface KeysetRows<E> {
  rows: E[];
  nextCursor: string | null;
  prevCursor: string | null;
  total: number;
  totalIsCapped: boolean;
}

/** Counts the rows the query matches, stopping at LIST_COUNT_CAP + 1 so a large table is never counted through. */
export async function cappedCount(qb: SelectQueryBuilder<ObjectLiteral>): Promise<{ total: number; totalIsCapped: boolean }> {
  const [sql, parameters] = qb
    .clone()
    .select('1', 'one')
    .orderBy()
    .offset(undefined)
    .limit(LIST_COUNT_CAP + 1)
    .getQueryAndParameters();
  const [row] = (await qb.connection.query(`SELECT COUNT(*) AS n FROM (${sql}) capped`, parameters)) as { n: number | string }[];
  const n = Number(row?.n ?? 0);
  return { total: Math.min(n, LIST_COUNT_CAP), totalIsCapped: n > LIST_COUNT_CAP };
}

/**
 * One page of `qb` (filters applied, no order) by keyset on (sort column, id): the next page starts after
 * the cursor's row, the previous one ends before it. The cursor row's sort value is read as text, so the
 * comparison keeps the database's own precision (PostgreSQL timestamps carry microseconds).
 */
export async function keysetPage<E extends { id: string }>(qb: SelectQueryBuilder<E>, options: KeysetOptions<E>): Promise<KeysetRows<E>> {
  const { alias, sortProperty, sort, order, cursor, pageSize } = options;
  const counted = options.countQuery ? await cappedCount(options.countQuery) : { total: 0, totalIsCapped: false };
  const backwards = cursor?.dir === 'before';
  const ascending = (order === 'asc') !== backwards;
  const sortExpression = `${alias}.${sortProperty}`;
  if (cursor) {
    const metadata = qb.expressionMap.mainAlias!.metadata;
    const column = metadata.findColumnWithPropertyName(sortProperty)!.databaseName;
    const boundary = (await qb.connection
      .createQueryBuilder()
      .select(`CAST(boundary.${column} AS text)`, 'value')
      .from(metadata.target, 'boundary')
      .where('boundary.id = :id', { id: cursor.id })
      .getRawOne()) as { value: string } | undefined;
    if (!boundary) throw badCursor('The row this page started from is gone; start again from the first page.');
    qb.andWhere(`(${sortExpression}, ${alias}.id) ${ascending ? '>' : '<'} (:keysetValue, :keysetId)`, {
      keysetValue: boundary.value,
      keysetId: cursor.id,
    });
  }
  const direction = ascending ? 'ASC' : 'DESC';
  const fetched = await qb
    .orderBy(sortExpression, direction)
    .addOrderBy(`${alias}.id`, direction)
    .limit(pageSize + 1)
    .getMany();
  const more = fetched.length > pageSize;
  const rows = fetched.slice(0, pageSize);
  if (backwards) rows.reverse();
  const make = (row: E | undefined, dir: KeysetDirection) => (row ? encodeCursor({ id: row.id, dir, sort, order }) : null);
  const first = rows[0];
  const last = rows[rows.length - 1];
  return {
    rows,
    nextCursor: backwards ? make(last, 'after') : more ? make(last, 'after') : null,
    prevCursor: backwards ? (more ? make(first, 'before') : null) : cursor ? make(first, 'before') : null,
    ...counted,
  };
}

/** Rows read per round trip where a queue filters rows further in code. */
export const QUEUE_BATCH = 200;

/** A forward-only slice of a queue: the entries after the one with id `after`, at most `limit`. */
export interface QueuePage {
  after: string | null;
  limit: number;
}
