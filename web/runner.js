// Requests to the core where only the newest matters, one rule for all of them: at most one request of
// a kind in flight; while it runs, newer requests replace one another and only the newest is sent next.
// The verdict's evaluations and its charts drop an answer that a newer request has made stale (the
// page shows 'loading' until the newest answer); the what-if slider shows every answer, each for a
// newer position than the one before it.

/**
 * Returns {submit(request), drop()}. `send(request)` returns a promise of the core's answer;
 * `onAnswer(answer, request)` and `onError(error, request)` receive the outcome of each request sent,
 * or, with `dropStale`, only of a request nothing newer was submitted after (nor `drop` called).
 */
export function latestWins(send, onAnswer, { onError = () => {}, dropStale = false } = {}) {
  let running = false;
  let waiting = null;
  let submitted = 0;
  const current = (n) => !dropStale || n === submitted;
  // One request at a time; a handler that throws is reported on the console and never stops the runner.
  const pump = async () => {
    running = true;
    try {
      while (waiting) {
        const { request, n } = waiting;
        waiting = null;
        let outcome;
        try {
          outcome = { answer: await send(request) };
        } catch (error) {
          outcome = { error };
        }
        if (!current(n)) continue;
        try {
          if ('answer' in outcome) onAnswer(outcome.answer, request);
          else onError(outcome.error, request);
        } catch (failure) {
          console.error(failure);
        }
      }
    } finally {
      running = false;
    }
  };
  return {
    submit(request) {
      submitted += 1;
      waiting = { request, n: submitted };
      if (!running) pump();
    },
    /** Whatever was submitted is stale: nothing waiting is sent, and (with dropStale) no answer under way is handed on. */
    drop() {
      submitted += 1;
      waiting = null;
    },
  };
}
