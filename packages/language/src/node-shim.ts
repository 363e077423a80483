/**
 * Node 20 lacks Object.groupBy (Node 21 has it); the parser toolkit under
 * Langium 4.4 calls it while checking the grammar. Imported first by the
 * language module; a no-op on newer runtimes.
 */
type GroupBy = <T>(items: Iterable<T>, keyOf: (item: T, index: number) => PropertyKey) => Record<PropertyKey, T[]>;

const objectWithGroupBy = Object as unknown as { groupBy?: GroupBy };
if (typeof objectWithGroupBy.groupBy !== 'function') {
  objectWithGroupBy.groupBy = <T>(items: Iterable<T>, keyOf: (item: T, index: number) => PropertyKey) => {
    const groups: Record<PropertyKey, T[]> = Object.create(null);
    let index = 0;
    for (const item of items) {
      const key = keyOf(item, index++);
      (groups[key] ??= []).push(item);
    }
    return groups;
  };
}

export {};
