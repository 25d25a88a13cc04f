import { Router } from 'express';
import { requireCapability } from '../../auth/passport';
import type { LiveBoard } from '../../live-board';
import type { LiveEvents } from '../../live';
import { liveBoardSnapshot, watchBoard } from './use-cases';

/** A snapshot at most this often while readings arrive; a heartbeat otherwise keeps proxies from closing the stream. */
const STREAM_TICK_MS = 2000;

/**
 * `GET /api/live/board` (a snapshot) and `GET /api/live/stream` (server-sent events: a board
 * snapshot whenever readings arrive, at most every two seconds, and a heartbeat otherwise).
 * The stream needs the same bearer token; the client reads it with fetch, not EventSource.
 */
export function liveRouter(board: LiveBoard, events: LiveEvents) {
  const router = Router();
  router.use(requireCapability('view'));

  router.get('/board', async (_req, res) => {
    res.json(await liveBoardSnapshot(board));
  });

  router.get('/stream', async (req, res) => {
    res.writeHead(200, {
      'Content-Type': 'text/event-stream',
      'Cache-Control': 'no-store, no-transform',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    let dirty = true;
    let closed = false;
    const send = async () => {
      if (closed) return;
      if (!dirty) {
        res.write(': heartbeat\n\n');
        return;
      }
      dirty = false;
      try {
        res.write(`event: board\ndata: ${JSON.stringify(await liveBoardSnapshot(board))}\n\n`);
      } catch {
        /* the next tick tries again */
      }
    };
    const stopWatching = watchBoard(events, () => (dirty = true));
    const timer = setInterval(() => void send(), STREAM_TICK_MS);
    req.on('close', () => {
      closed = true;
      clearInterval(timer);
      stopWatching();
    });
    await send();
  });

  return router;
}
