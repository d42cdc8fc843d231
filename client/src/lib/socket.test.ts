import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

/** A stand-in for the socket.io client: records what is emitted and lets the test play the server's side. */
class FakeSocket {
  connected = false;
  active = false;
  handlers = new Map<string, ((...args: unknown[]) => void)[]>();
  emitted: { event: string; args: unknown[] }[] = [];
  on(event: string, fn: (...args: unknown[]) => void) {
    this.handlers.set(event, [...(this.handlers.get(event) ?? []), fn]);
    return this;
  }
  emit(event: string, ...args: unknown[]) {
    this.emitted.push({ event, args });
    const ack = args[args.length - 1];
    if (typeof ack === 'function') ack({ ok: true });
    return this;
  }
  connect = vi.fn(() => {
    this.active = true;
    return this;
  });
  disconnect = vi.fn(() => {
    this.active = false;
    this.serverSays('disconnect', 'io client disconnect');
    return this;
  });
  serverSays(event: string, ...args: unknown[]) {
    if (event === 'connect') this.connected = true;
    if (event === 'disconnect') this.connected = false;
    this.handlers.get(event)?.forEach((fn) => fn(...args));
  }
  watched(event: string) {
    return this.emitted.filter((e) => e.event === event).map((e) => e.args[0]);
  }
}

let fake: FakeSocket;
vi.mock('socket.io-client', () => ({ io: () => fake }));

async function load() {
  vi.resetModules();
  return import('./socket');
}

beforeEach(() => {
  fake = new FakeSocket();
  vi.useFakeTimers();
});
afterEach(() => vi.useRealTimers());

describe('the live connection', () => {
  it('connects when a screen watches, joins the room once connected, and says it is live', async () => {
    const { useLiveRoom, useLiveSnapshot } = await load();
    const handlers = { onChanged: vi.fn(), onResync: vi.fn() };
    const { result } = renderHook(() => ({ joined: useLiveRoom('flight', 7, handlers), live: useLiveSnapshot() }));
    expect(fake.connect).toHaveBeenCalledTimes(1);
    expect(result.current.live.state).toBe('connecting');
    act(() => fake.serverSays('connect'));
    expect(fake.watched('flight:watch')).toEqual([7]);
    expect(result.current.joined).toBe(true);
    expect(result.current.live.state).toBe('live');
  });

  it('passes on change notices for its own room only', async () => {
    const { useLiveRoom } = await load();
    const handlers = { onChanged: vi.fn(), onResync: vi.fn() };
    renderHook(() => useLiveRoom('flight', 7, handlers));
    act(() => fake.serverSays('connect'));
    act(() => fake.serverSays('flight:changed', { id: 8 }));
    act(() => fake.serverSays('station:changed', { id: 7 }));
    expect(handlers.onChanged).not.toHaveBeenCalled();
    act(() => fake.serverSays('flight:changed', { id: 7, topics: ['counts'] }));
    expect(handlers.onChanged).toHaveBeenCalledWith({ id: 7, topics: ['counts'] });
    expect(handlers.onResync).not.toHaveBeenCalled();
  });

  it('shows the loss, then on reconnect re-joins, asks for a full refetch and says "Live again" briefly', async () => {
    const { useLiveRoom, useLiveSnapshot, describeLive } = await load();
    const handlers = { onChanged: vi.fn(), onResync: vi.fn() };
    const { result } = renderHook(() => ({ joined: useLiveRoom('station', 3, handlers), live: useLiveSnapshot() }));
    act(() => fake.serverSays('connect'));
    act(() => fake.serverSays('disconnect', 'transport close'));
    expect(result.current.live.state).toBe('lost');
    expect(describeLive(result.current.live.state, result.current.joined).text).toBe('Connection lost — reconnecting…');

    act(() => fake.serverSays('connect'));
    expect(fake.watched('station:watch')).toEqual([3, 3]);
    expect(handlers.onResync).toHaveBeenCalledTimes(1);
    expect(describeLive(result.current.live.state, result.current.joined).text).toBe('Live again');
    act(() => vi.advanceTimersByTime(4_000));
    expect(result.current.live.state).toBe('live');
  });

  it('tries again by itself after the server drops us, while a screen still watches', async () => {
    const { useLiveRoom } = await load();
    renderHook(() => useLiveRoom('flight', 7, { onChanged: vi.fn(), onResync: vi.fn() }));
    act(() => fake.serverSays('connect'));
    fake.active = false;
    act(() => fake.serverSays('disconnect', 'io server disconnect'));
    expect(fake.connect).toHaveBeenCalledTimes(1);
    act(() => vi.advanceTimersByTime(5_000));
    expect(fake.connect).toHaveBeenCalledTimes(2);
  });

  it('leaves the room when the screen goes, and closes the connection once nothing is watched', async () => {
    const { useLiveRoom, useLiveSnapshot } = await load();
    const { unmount } = renderHook(() => useLiveRoom('flight', 7, { onChanged: vi.fn(), onResync: vi.fn() }));
    const snap = renderHook(() => useLiveSnapshot());
    act(() => fake.serverSays('connect'));
    unmount();
    expect(fake.watched('flight:unwatch')).toEqual([7]);
    expect(fake.disconnect).not.toHaveBeenCalled();
    act(() => vi.advanceTimersByTime(5_000));
    expect(fake.disconnect).toHaveBeenCalledTimes(1);
    expect(snap.result.current.state).toBe('idle');
  });

  it('says plainly when the server refused the room', async () => {
    const { describeLive } = await load();
    expect(describeLive('live', false).text).toMatch(/refused/);
    expect(describeLive('live', true)).toEqual({ tone: 'calm', icon: '●', text: 'Live' });
  });
});
