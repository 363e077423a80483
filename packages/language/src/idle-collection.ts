import v8 from 'node:v8';
import vm from 'node:vm';

/** Quiet time after the last analysis before the server collects garbage, ms (our choice: past a typing pause). */
const IDLE_MS = 1500;

/**
 * Collects garbage once the server has been quiet for a moment after an
 * analysis. Each build and analysis of a large system leaves tens of
 * megabytes behind, and V8 lets the heap grow well past what is live before
 * it collects on its own; collecting while the user pauses keeps the
 * server's memory near what it holds. `activity` is called on each event
 * that restarts the quiet time. Without a collector (V8 refusing the flag)
 * this does nothing.
 */
export function idleCollector(): { activity(): void } {
  let gc: (() => void) | undefined;
  try {
    v8.setFlagsFromString('--expose-gc');
    const found = vm.runInNewContext('gc') as unknown;
    if (typeof found === 'function') gc = found as () => void;
  } catch {
    gc = undefined;
  }
  let timer: NodeJS.Timeout | undefined;
  return {
    activity() {
      if (!gc) return;
      if (timer) clearTimeout(timer);
      timer = setTimeout(() => {
        timer = undefined;
        gc!();
      }, IDLE_MS);
      timer.unref();
    },
  };
}
