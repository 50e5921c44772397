import { describe, it, expect } from 'vitest';
import { EventEmitter } from 'node:events';
import { createRequestQueue } from '../../integrations/request-queue.mjs';

class FakeRes extends EventEmitter {
  constructor(readonly id: number) {
    super();
  }
  finish() {
    this.emit('finish');
  }
}
// A few turns of the event loop: the queue starts one request per turn.
const turn = async () => {
  for (let i = 0; i < 5; i++) await new Promise((r) => setImmediate(r));
};
const recordInto = (started: number[]) =>
  ((_req: unknown, res: unknown) => void started.push((res as FakeRes).id)) as never;

describe('request queue', () => {
  it('starts requests in arrival order, never more than the limit at once', async () => {
    const started: number[] = [];
    const enqueue = createRequestQueue(recordInto(started), { inFlight: 2 });
    const res = [1, 2, 3, 4, 5].map((id) => new FakeRes(id));
    for (const r of res) enqueue({ destroyed: false } as never, r as never);
    expect(started).toEqual([]);
    await turn();
    expect(started).toEqual([1, 2]);
    res[1].finish();
    await turn();
    expect(started).toEqual([1, 2, 3]);
    res[0].emit('close');
    res[2].finish();
    await turn();
    expect(started).toEqual([1, 2, 3, 4, 5]);
  });

  it('skips a request whose client left while it waited', async () => {
    const started: number[] = [];
    const enqueue = createRequestQueue(recordInto(started), { inFlight: 1 });
    enqueue({ destroyed: true } as never, new FakeRes(1) as never);
    enqueue({ destroyed: false } as never, new FakeRes(2) as never);
    await turn();
    expect(started).toEqual([2]);
  });

  it('a slow answer gives up its place, so one slow client holds nobody up for long', async () => {
    let clock = 0;
    const started: number[] = [];
    const enqueue = createRequestQueue(recordInto(started), { inFlight: 1, slowMs: 500, now: () => clock });
    enqueue({ destroyed: false } as never, new FakeRes(1) as never);
    enqueue({ destroyed: false } as never, new FakeRes(2) as never);
    await turn();
    expect(started).toEqual([1]);
    clock = 499;
    enqueue.sweep();
    await turn();
    expect(started).toEqual([1]);
    clock = 501;
    enqueue.sweep();
    await turn();
    expect(started).toEqual([1, 2]);
    expect(enqueue.running()).toBe(1);
  });
});
