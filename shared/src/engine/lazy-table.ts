interface LazyTable {
  built: boolean;
  /** Whether the table, once built, holds only finite numbers (read from its columns, without building it). */
  allFinite: () => boolean;
}

const lazyTables = new WeakMap<object, Map<string, LazyTable>>();

/**
 * Makes `target[key]` an enumerable property whose value is built on first read and kept: JSON.stringify, structuredClone,
 * spreading and every reader see the same value a plain property would hold, at the place the key already has in `target`.
 */
export function defineLazyTable<T extends object, K extends keyof T & string>(
  target: T,
  key: K,
  build: () => T[K],
  allFinite: () => boolean,
): void {
  const table: LazyTable = { built: false, allFinite };
  let value: T[K] | undefined;
  Object.defineProperty(target, key, {
    enumerable: true,
    configurable: true,
    get: () => {
      if (!table.built) {
        value = build();
        table.built = true;
      }
      return value;
    },
    set: (next: T[K]) => {
      value = next;
      table.built = true;
    },
  });
  let tables = lazyTables.get(target);
  if (!tables) lazyTables.set(target, (tables = new Map()));
  tables.set(key, table);
}

/** For each key of `target` whose table is not built yet: whether it would hold only finite numbers. */
export function unbuiltTables(target: object): Map<string, LazyTable> | undefined {
  return lazyTables.get(target);
}
