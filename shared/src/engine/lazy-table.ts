/**
 * A per-standard table built from its columns when first read and kept. The result object exposes it through a getter and
 * setter written in its object literal (which keeps the object's fast shape, unlike redefining a property afterwards), so
 * JSON.stringify, structuredClone, spreading and every reader see the value a plain property would hold, at its place.
 */
export class LazyTable<T> {
  built = false;
  private value: T | undefined;

  constructor(
    private readonly build: () => T,
    /** Whether the table, once built, holds only finite numbers (read from its columns, without building it). */
    readonly allFinite: () => boolean,
  ) {}

  get(): T {
    if (!this.built) {
      this.value = this.build();
      this.built = true;
    }
    return this.value as T;
  }

  set(next: T): void {
    this.value = next;
    this.built = true;
  }
}

const lazyTables = new WeakMap<object, ReadonlyMap<string, LazyTable<unknown>>>();

/** Tells the finite guard which keys of `target` are lazy tables, so that it can ask their columns instead of building them. */
export function registerLazyTables(target: object, tables: Record<string, LazyTable<unknown>>): void {
  lazyTables.set(target, new Map(Object.entries(tables)));
}

/** For each key of `target` that is a lazy table: its state, and whether it would hold only finite numbers. */
export function unbuiltTables(target: object): ReadonlyMap<string, LazyTable<unknown>> | undefined {
  return lazyTables.get(target);
}
