/**
 * Ordered acknowledgements for pipelined publishes (issue 15 §2).
 *
 * aedes handles a client's packets one socket read at a time: it reads the next chunk only after
 * every packet of the current one has called back, and a QoS 1 packet calls back only after its
 * PUBACK is written. Holding aedes' `authorizePublish` callback until the commit (as before)
 * therefore serialised each connection on the database: a gateway carrying all its tags on one
 * connection waited for one commit per read, whatever its in-flight window.
 *
 * Here the packet flow and the acknowledgement are separated. A device's QoS 0/1 publish takes a
 * slot (per connection and overall), is handed to the writer, and aedes is answered at once with
 * the packet turned into a QoS 0 publish on a topic nobody can hear, so aedes neither writes a
 * PUBACK nor forwards anything and goes on to the next packet. The PUBACK is written here, only
 * once the message's own readings are committed, and in the order the messages arrived
 * (MQTT 3.1.1 §4.6): a message whose commit ends early waits behind the earlier ones. The message
 * is forwarded to subscribers (with its own QoS) at the same moment, so a subscriber never hears a
 * reading that is not stored. An acknowledged reading is still a committed reading.
 *
 * A commit that fails (the database is unreachable) acknowledges nothing from that message on: its
 * turn closes the connection, and the device sends it again, as before. A message refused by the
 * ingest path (bad payload, unknown transmitter, another site) is settled like any other, so it is
 * acknowledged in its turn and costs only itself.
 *
 * Back-pressure, never an unbounded queue: a message holds its slot until it is acknowledged (or
 * its connection is gone and its commit settled). When a connection's window or the overall one is
 * full, the aedes callback of the next packet is held: aedes then reads nothing more from that
 * socket (it reads only after the current chunk's packets have all called back), the kernel buffers
 * fill and TCP slows the publisher down. At most one socket read of parsed packets waits per
 * connection beyond its window.
 */

/** A counting semaphore whose waiters are served in arrival order. */
export class Slots {
  private used = 0;
  private readonly waiters: (() => void)[] = [];

  constructor(readonly limit: number) {}

  get inUse(): number {
    return this.used;
  }

  /** Runs `then` once a slot is held: at once when one is free. */
  take(then: () => void): void {
    if (this.used < this.limit && this.waiters.length === 0) {
      this.used++;
      then();
    } else this.waiters.push(then);
  }

  give(): void {
    const next = this.waiters.shift();
    if (next) next();
    else this.used--;
  }
}

/** One message between its arrival and its acknowledgement. */
interface Pending {
  /** Settled: committed (or refused by the ingest path), failed, or still on its way. */
  state: 'writing' | 'stored' | 'failed';
  /** What to do in its turn, once stored: write the PUBACK, forward it. */
  acknowledge: () => void;
  /** Whether it holds slots (taken once it was handed to the writer). */
  holdsSlots: boolean;
}

/** The ordered acknowledgements of one connection. */
export class ConnectionLane {
  private readonly queue: Pending[] = [];
  private closed = false;
  readonly slots: Slots;
  /** The most messages this connection ever had between arrival and acknowledgement (for tests). */
  highWater = 0;

  constructor(
    perConnection: number,
    private readonly overall: Slots,
    private readonly close: () => void,
  ) {
    this.slots = new Slots(perConnection);
  }

  /** Messages handed to the writer and not yet acknowledged. */
  get inFlight(): number {
    return this.slots.inUse;
  }

  /**
   * Takes a message in its arrival order (call synchronously, as aedes hands packets over in the
   * order they were read). Once it holds its slots, `start` hands it to the writer and answers aedes;
   * `acknowledge` runs in its turn once the commit resolved.
   */
  admit(start: () => Promise<unknown>, acknowledge: () => void, refuse: () => void): void {
    const pending: Pending = { state: 'writing', acknowledge, holdsSlots: false };
    this.queue.push(pending);
    this.slots.take(() =>
      this.overall.take(() => {
        pending.holdsSlots = true;
        if (this.closed) {
          this.settle(pending, 'failed');
          return refuse();
        }
        this.highWater = Math.max(this.highWater, this.slots.inUse);
        start().then(
          () => this.settle(pending, 'stored'),
          () => this.settle(pending, 'failed'),
        );
      }),
    );
  }

  /** The connection is gone: nothing more is acknowledged; slots go back as commits settle. */
  closing(): void {
    if (this.closed) return;
    this.closed = true;
    for (const p of this.queue.splice(0)) if (p.state !== 'writing') this.release(p);
  }

  private settle(pending: Pending, state: 'stored' | 'failed') {
    pending.state = state;
    if (this.closed) return this.release(pending);
    while (this.queue.length && this.queue[0].state !== 'writing') {
      const head = this.queue[0];
      if (head.state === 'failed') {
        // Nothing from here on may be acknowledged (order): the device sends them again.
        this.closing();
        this.release(head);
        return this.close();
      }
      this.queue.shift();
      head.acknowledge();
      this.release(head);
    }
  }

  private release(pending: Pending) {
    if (!pending.holdsSlots) return;
    pending.holdsSlots = false;
    this.overall.give();
    this.slots.give();
  }
}
