import { ConnectionLane, Slots } from './publish-pipeline';

/** A commit the test settles by hand. */
function commit() {
  let resolve!: () => void;
  let reject!: (err: Error) => void;
  const promise = new Promise<void>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  return { promise, resolve, reject };
}
const turn = () => new Promise((r) => setImmediate(r));

function lane(perConnection: number, overall = new Slots(1000)) {
  const events: string[] = [];
  let closed = false;
  const l = new ConnectionLane(perConnection, overall, () => (closed = true));
  const commits: ReturnType<typeof commit>[] = [];
  const send = (i: number) =>
    l.admit(
      () => {
        events.push(`start ${i}`);
        const c = commit();
        commits[i] = c;
        return c.promise;
      },
      () => events.push(`ack ${i}`),
      () => events.push(`refused ${i}`),
    );
  return { lane: l, events, commits, send, closed: () => closed };
}

it('acknowledges in arrival order even when later commits end first', async () => {
  const t = lane(10);
  for (let i = 0; i < 4; i++) t.send(i);
  t.commits[2].resolve();
  t.commits[1].resolve();
  await turn();
  expect(t.events.filter((e) => e.startsWith('ack'))).toEqual([]);
  t.commits[0].resolve();
  await turn();
  expect(t.events.filter((e) => e.startsWith('ack'))).toEqual(['ack 0', 'ack 1', 'ack 2']);
  t.commits[3].resolve();
  await turn();
  expect(t.events.filter((e) => e.startsWith('ack'))).toEqual(['ack 0', 'ack 1', 'ack 2', 'ack 3']);
  expect(t.lane.inFlight).toBe(0);
});

it('holds the in-flight count at its bound and starts the next message only when one is acknowledged', async () => {
  const t = lane(3);
  for (let i = 0; i < 6; i++) t.send(i);
  expect(t.events).toEqual(['start 0', 'start 1', 'start 2']);
  expect(t.lane.inFlight).toBe(3);
  // A later commit ending first frees nothing: its acknowledgement waits behind message 0.
  t.commits[1].resolve();
  await turn();
  expect(t.lane.inFlight).toBe(3);
  t.commits[0].resolve();
  await turn();
  expect(t.events).toEqual(['start 0', 'start 1', 'start 2', 'ack 0', 'start 3', 'ack 1', 'start 4']);
  expect(t.lane.inFlight).toBe(3);
  expect(t.lane.highWater).toBe(3);
});

it('shares the overall bound between connections', () => {
  const overall = new Slots(4);
  const a = lane(3, overall);
  const b = lane(3, overall);
  for (let i = 0; i < 3; i++) a.send(i);
  for (let i = 0; i < 3; i++) b.send(i);
  expect(a.events).toEqual(['start 0', 'start 1', 'start 2']);
  expect(b.events).toEqual(['start 0']);
  expect(overall.inUse).toBe(4);
});

it('acknowledges nothing from a failed commit on, closes the connection, and gives its slots back', async () => {
  const overall = new Slots(10);
  const t = lane(10, overall);
  for (let i = 0; i < 4; i++) t.send(i);
  t.commits[0].resolve();
  t.commits[2].resolve();
  t.commits[1].reject(new Error('database unreachable'));
  await turn();
  expect(t.events.filter((e) => e.startsWith('ack'))).toEqual(['ack 0']);
  expect(t.closed()).toBe(true);
  t.commits[3].resolve();
  await turn();
  expect(t.events.filter((e) => e.startsWith('ack'))).toEqual(['ack 0']);
  expect(overall.inUse).toBe(0);
});

it('refuses a waiting message once its connection is gone, and keeps no slot for it', async () => {
  const overall = new Slots(10);
  const t = lane(1, overall);
  t.send(0);
  t.send(1);
  t.lane.closing();
  t.commits[0].resolve();
  await turn();
  expect(t.events).toEqual(['start 0', 'refused 1']);
  expect(overall.inUse).toBe(0);
  expect(t.lane.inFlight).toBe(0);
});
