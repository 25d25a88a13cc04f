import { Router } from 'express';
import { requireCapability } from '../../auth/passport';
import type { LiveBoard } from '../../live-board';
import type { LiveEvents } from '../../live';

/**
 * `GET /api/live/board` (a snapshot) and `GET /api/live/stream` (server-sent events: a board
 * snapshot whenever readings arrive, at most every two seconds, and a heartbeat otherwise).
 * The stream needs the same bearer token; the client reads it with fetch, not EventSource.
 */
export function liveRouter(board: LiveBoard, events: LiveEvents) {
  const router = Router();
  router.use(requireCapability('view'));

  router.get('/board', async (_req, res) => {
    res.json(await board.snapshot());
  });

  router.get('/stream', async (req, res) => {
    res.writeHead(200, {
      'Content-Type': 'text/event-stream',
      'Cache-Control': 'no-cache, no-transform',
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
        res.write(`event: board\ndata: ${JSON.stringify(await board.snapshot())}\n\n`);
      } catch {
        /* the next tick tries again */
      }
    };
    const mark = () => (dirty = true);
    events.on('readings', mark);
    events.on('history', mark);
    const timer = setInterval(() => void send(), 2000);
    req.on('close', () => {
      closed = true;
      clearInterval(timer);
      events.off('readings', mark);
      events.off('history', mark);
    });
    await send();
  });

  return router;
}
