/** A function that runs `action` once, `delayMs` after the last of a burst of calls. */
export interface Debounced<A extends unknown[]> {
  (...args: A): void;
  /** Drops a pending run. */
  cancel(): void;
}

export function debounce<A extends unknown[]>(action: (...args: A) => void, delayMs: number): Debounced<A> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const debounced = (...args: A) => {
    if (timer !== undefined) clearTimeout(timer);
    timer = setTimeout(() => {
      timer = undefined;
      action(...args);
    }, delayMs);
  };
  debounced.cancel = () => {
    if (timer !== undefined) clearTimeout(timer);
    timer = undefined;
  };
  return debounced;
}
