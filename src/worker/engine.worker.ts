/// <reference lib="webworker" />
// Worker entry: a thin shell around the message switches. The same entry serves the page's engine link
// (runs, single-worker grids) and the grid pool's members (bands).
import type { FromPoolMember, FromWorker, ToPoolMember, ToWorker } from '../protocol';
import { createBandHandler, isPoolMessage } from './bands';
import { createHandler } from './handler';
import { workerTiming } from './scheduler';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (msg: FromWorker | FromPoolMember) => scope.postMessage(msg);
const timing = workerTiming();
const handle = createHandler(post, timing);
const handleBand = createBandHandler(post, timing);
scope.onmessage = (e: MessageEvent<ToWorker | ToPoolMember>) => (isPoolMessage(e.data) ? handleBand(e.data) : handle(e.data));
