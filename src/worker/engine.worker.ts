/// <reference lib="webworker" />
// Worker entry: a thin shell around the message switches. The same entry serves the page's engine link
// (runs, single-worker grids), the study link and the grid pool's members (bands). Pings of the page's
// link (liveness, store/engine-link.ts) are answered here.
import type { FromPoolMember, FromWorker, LinkPing, LinkPong, ToPoolMember, ToWorker } from '../protocol';
import { createBandHandler, isPoolMessage } from './bands';
import { createHandler } from './handler';
import { workerTiming } from './scheduler';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (msg: FromWorker | FromPoolMember | LinkPong) => scope.postMessage(msg);
const timing = workerTiming();
const handle = createHandler(post, timing);
const handleBand = createBandHandler(post, timing);
scope.onmessage = (e: MessageEvent<ToWorker | ToPoolMember | LinkPing>) => {
  const msg = e.data;
  if (msg.type === 'link/ping') return post({ type: 'link/pong' });
  return isPoolMessage(msg) ? handleBand(msg) : handle(msg);
};
