/**
 * One line on stderr that counts the files checked so far, rewritten in
 * place, for a terminal only; cleared before the results print. Updates at
 * most every PROGRESS_INTERVAL_MS so it costs nothing measurable.
 */
export interface ProgressLine {
  update(done: number, total: number): void;
  clear(): void;
}

/** Below this many files a check is quick enough that a progress line would only flicker (our choice). */
export const PROGRESS_MIN_FILES = 10;
/** 100 ms between updates: about the fastest a reader can follow (Nielsen 1993, 0.1 s). */
const PROGRESS_INTERVAL_MS = 100;

const NONE: ProgressLine = { update() {}, clear() {} };

export function progressLine(write: (text: string) => void, enabled: boolean, total: number, now: () => number = () => performance.now()): ProgressLine {
  if (!enabled || total < PROGRESS_MIN_FILES) return NONE;
  let last = -Infinity;
  let shown = false;
  return {
    update(done, all) {
      const t = now();
      if (done < all && t - last < PROGRESS_INTERVAL_MS) return;
      last = t;
      shown = true;
      // \r back to the line start, ESC[K erases the rest of it (ECMA-48 EL).
      write(`\r\u001b[KChecking ${done}/${all} files...`);
    },
    clear() {
      if (shown) write('\r\u001b[K');
      shown = false;
    },
  };
}
