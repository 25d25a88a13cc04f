import type { LiveBoard } from '../../live-board';
import type { LiveEvents } from '../../live';

/**
 * The live board reads the database itself (server/live-board.ts) and keeps the stacked-pair
 * choice between snapshots, so it stands in for this resource's repository.
 */
export const liveBoardSnapshot = (board: LiveBoard) => board.snapshot();

/**
 * Calls `changed` whenever the board may differ: readings were stored or hourly records
 * recomputed (today's totals).
 * @returns a function that stops watching
 */
export function watchBoard(events: LiveEvents, changed: () => void): () => void {
  events.on('readings', changed);
  events.on('history', changed);
  return () => {
    events.off('readings', changed);
    events.off('history', changed);
  };
}
