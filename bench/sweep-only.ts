/**
 * `node bench/runner.mjs /bench/sweep-only.ts`: only the bundled sweep and run-loop part of the bench
 * (bench/sweep.ts), for development; prints its ratios and writes nothing.
 */
import { bundledSweepBench } from './sweep-bundle';

const s = await bundledSweepBench();
console.log(`sweep_vs_handwritten ${s.ratio.toFixed(3)} (engine ${s.engineMs.toFixed(1)} ms, hand-written ${s.handwrittenMs.toFixed(1)} ms)`);
console.log(`sweep_cost_growth ${s.growth.toFixed(3)} (16,384 starts ${s.largeMs.toFixed(1)} ms)`);
console.log(`run_loop_vs_handwritten ${s.runLoopRatio.toFixed(3)} (run loop ${s.runLoopStepsPerS.toExponential(3)} steps/s, hand-written ${s.runLoopHandwrittenStepsPerS.toExponential(3)} steps/s)`);
