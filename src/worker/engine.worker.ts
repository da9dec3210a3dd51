/// <reference lib="webworker" />
// Worker entry: a thin shell around the message switch.
import type { FromWorker, ToWorker } from '../protocol';
import { createHandler } from './handler';
import { workerTiming } from './scheduler';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const handle = createHandler((msg: FromWorker, transfer?: Transferable[]) => scope.postMessage(msg, transfer ?? []), workerTiming());
scope.onmessage = (e: MessageEvent<ToWorker>) => handle(e.data);
