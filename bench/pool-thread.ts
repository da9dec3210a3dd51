// A grid-pool member as a Node worker thread: the same band handler the page's engine worker runs
// (src/worker/bands.ts), behind worker_threads' port instead of a Web Worker's scope. bench/pool.ts
// bundles this file into bench/.cache/ before starting threads.
import { parentPort } from 'node:worker_threads';
import type { ToPoolMember } from '../src/protocol';
import { createBandHandler } from '../src/worker/bands';
import { workerTiming } from '../src/worker/scheduler';

const port = parentPort;
if (!port) throw new Error('bench/pool-thread: run me as a worker thread');
const handle = createBandHandler((msg) => port.postMessage(msg), workerTiming());
port.on('message', (msg: ToPoolMember) => handle(msg));
