// Requests to the core where only the newest matters (a slider being dragged): at most one in flight;
// while it runs, newer requests replace one another and only the newest is sent next. Every answer
// is handed on, in order: each is for a newer request than the one shown before it.

/**
 * Returns `submit(request)`. `send(request)` returns a promise of the core's answer; `onAnswer(answer,
 * request)` and `onError(error, request)` receive the outcome of each request actually sent.
 */
export function latestWins(send, onAnswer, onError = () => {}) {
  let running = false;
  let waiting = null;
  const pump = async () => {
    running = true;
    while (waiting) {
      const { request } = waiting;
      waiting = null;
      try {
        onAnswer(await send(request), request);
      } catch (error) {
        onError(error, request);
      }
    }
    running = false;
  };
  return (request) => {
    waiting = { request };
    if (!running) pump();
  };
}
