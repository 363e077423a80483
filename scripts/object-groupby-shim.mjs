// Node 20 lacks Object.groupBy (added in Node 21); the grammar checks of the
// parser toolkit under Langium 4.4 call it. A no-op on newer Node.
if (typeof Object.groupBy !== 'function') {
  Object.groupBy = function groupBy(items, keyOf) {
    const groups = Object.create(null);
    let index = 0;
    for (const item of items) {
      const key = keyOf(item, index++);
      (groups[key] ??= []).push(item);
    }
    return groups;
  };
}
