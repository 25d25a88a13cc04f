import { EventEmitter } from 'node:events';

/**
 * In-process fan-out of "something changed" events for live views (server-sent events):
 * readings stored for a meter run, hourly records recomputed.
 */
export class LiveEvents extends EventEmitter {
  constructor() {
    super();
    this.setMaxListeners(1000);
  }

  readingsStored(meterRunIds: Iterable<string>) {
    this.emit('readings', [...new Set(meterRunIds)]);
  }

  historyChanged(meterRunIds: string[]) {
    this.emit('history', meterRunIds);
  }
}
