/**
 * The feed a host's helper thread is read through (src/pipeline/helperFeed.ts), with a scripted
 * thread: answers come out in the order posted, whether they arrive before or after they are asked
 * for; a failure or early end answers `stopped` to the waiting reader and to every later one, with
 * the first reason; close() ends the thread and is safe twice; a reader waiting on a busy helper
 * hears a stop request (answerOrStop). (Plain queue semantics: the
 * reference is the order of posting.)
 */
import { describe, expect, it } from 'vitest';
import { FqeCancelledError } from '../../src/core/fqe/fqeErrors';
import { answerOrStop, helperFeed, type HelperPort } from '../../src/pipeline/helperFeed';
import type { HelperAnswer } from '../../src/pipeline/helperFeed';

function scripted(): { port: HelperPort; post(a: HelperAnswer): void; stop(why: string): void; terminated: number } {
  let heard: Parameters<HelperPort['listen']>[0] | null = null;
  const thread = {
    terminated: 0,
    port: { listen: (h: Parameters<HelperPort['listen']>[0]) => { heard = h; }, terminate: () => { thread.terminated++; } },
    post: (a: HelperAnswer) => heard!.answer(a),
    stop: (why: string) => heard!.stopped(why),
  };
  return thread;
}

const block = (first: number): HelperAnswer => ({ first, outcomes: [], models: null });

describe('helperFeed', () => {
  it('hands out answers in order, posted before or after they are asked for', async () => {
    const thread = scripted(), feed = helperFeed(thread.port);
    thread.post(block(0));
    thread.post(block(8));
    expect(await feed.next()).toEqual(block(0));
    expect(await feed.next()).toEqual(block(8));
    const later = feed.next();
    thread.post(block(16));
    expect(await later).toEqual(block(16));
  });

  it('answers stopped, with the first reason, to the one waiting and to every later reader', async () => {
    const thread = scripted(), feed = helperFeed(thread.port);
    const waiting = feed.next();
    thread.stop('stopped: out of memory');
    thread.stop('ended (exit code 1)');
    expect(await waiting).toEqual({ stopped: 'stopped: out of memory' });
    expect(await feed.next()).toEqual({ stopped: 'stopped: out of memory' });
  });

  it('gives the answers already posted before it says stopped', async () => {
    const thread = scripted(), feed = helperFeed(thread.port);
    thread.post(block(0));
    thread.stop('ended before the last block');
    expect(await feed.next()).toEqual(block(0));
    expect(await feed.next()).toEqual({ stopped: 'ended before the last block' });
  });

  it('close ends the thread, answers a waiting reader, and is safe twice', async () => {
    const thread = scripted(), feed = helperFeed(thread.port);
    const waiting = feed.next();
    feed.close();
    feed.close();
    expect(await waiting).toEqual({ stopped: 'was closed' });
    expect(thread.terminated).toBe(2);
  });

  it('hears a stop request while the helper is still busy, and else gives the answer when it comes', async () => {
    const busy = helperFeed(scripted().port);
    let stop = false;
    setTimeout(() => { stop = true; }, 120);
    await expect(answerOrStop(busy, () => stop)).rejects.toBeInstanceOf(FqeCancelledError);
    const thread = scripted(), feed = helperFeed(thread.port);
    setTimeout(() => thread.post(block(0)), 120);
    expect(await answerOrStop(feed, () => false)).toEqual(block(0));
  });
});
