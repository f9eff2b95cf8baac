/**
 * Long work written once as a generator that yields at safe points, then either run straight
 * through (tests, small inputs) or in slices that hand the event loop back between them, so a
 * 10 MB file never holds up the server's other requests.
 *
 * Why slices and not a worker thread: the work is a few hundred milliseconds at most, the
 * input would have to be copied to the worker and the answer back, and a worker script must be
 * found at run time outside Next's bundle. Slicing costs nothing and works wherever the code
 * runs (next start, next dev, tests, the benchmark).
 */
export type Steps<T> = Generator<void, T, void>;

/** How long one slice may run before the event loop gets a turn. */
export const SLICE_MS = 15;

export function runToEnd<T>(steps: Steps<T>): T {
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
  }
}

const nextTurn = () =>
  new Promise<void>((resolve) => (typeof setImmediate === "function" ? setImmediate(resolve) : setTimeout(resolve, 0)));

export async function runInSlices<T>(steps: Steps<T>, sliceMs = SLICE_MS): Promise<T> {
  let sliceStart = performance.now();
  for (;;) {
    const next = steps.next();
    if (next.done) return next.value;
    if (performance.now() - sliceStart >= sliceMs) {
      await nextTurn();
      sliceStart = performance.now();
    }
  }
}

/** Lets the event loop run once (between batches of synchronous database work). */
export const yieldToEventLoop = nextTurn;
