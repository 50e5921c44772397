// Starts requests in the order they arrived, one per turn of the event loop and at most `inFlight` at a time.
// Started as soon as they are parsed, a render-heavy load let some requests wait many rounds behind newer ones
// (p99 twenty times the median at 50 connections, even for a plain Node server doing 2 ms of work per answer; see
// bench/http.ts), and a render that yields (React's server renderer does) went to the back of the line each time.
// A request holds its place until its answer is sent, or for `slowMs` at most, so a slow upload or download never
// holds the others up for long. Used by integrations/server-entry.mjs.

/**
 * @param {(req: import('node:http').IncomingMessage, res: import('node:http').ServerResponse) => void} answer
 * @param {{ inFlight?: number; slowMs?: number; now?: () => number }} [options]
 * @returns {((req: import('node:http').IncomingMessage, res: import('node:http').ServerResponse) => void) & { sweep: () => void; running: () => number }}
 */
export function createRequestQueue(answer, { inFlight = 8, slowMs = 500, now = () => performance.now() } = {}) {
  const waiting = [];
  /** Requests started and not yet answered, oldest first, with the time they started. */
  const running = new Map();
  let scheduled = false;
  const pump = () => {
    if (!scheduled && waiting.length > 0 && running.size < inFlight) {
      scheduled = true;
      setImmediate(startWaiting);
    }
  };
  const release = (res) => {
    if (running.delete(res)) pump();
  };
  const startWaiting = () => {
    scheduled = false;
    // One per turn: between two starts the loop reads the sockets and runs the continuations of started renders,
    // which keeps p99 near the median (a batch per turn doubled p99 in the mixed bench).
    if (waiting.length > 0 && running.size < inFlight) {
      const req = waiting.shift();
      const res = waiting.shift();
      if (!req.destroyed) {
        running.set(res, now());
        res.once('finish', () => release(res));
        res.once('close', () => release(res));
        answer(req, res);
      }
    }
    pump();
  };
  // Slow answers give up their place (checked a few times a second rather than with a timer per request).
  const sweep = () => {
    const old = now() - slowMs;
    for (const [res, at] of running) {
      if (at > old) break;
      release(res);
    }
  };
  setInterval(sweep, Math.min(100, slowMs)).unref();
  const enqueue = (req, res) => {
    waiting.push(req, res);
    pump();
  };
  enqueue.sweep = sweep;
  enqueue.running = () => running.size;
  return enqueue;
}
