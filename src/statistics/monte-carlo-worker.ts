/**
 * The worker side of a Monte Carlo pool: runs one job (a range of samples) and returns its result as
 * typed arrays (their buffers transferred), reporting progress as samples finish (at most every
 * 20 ms, and at the end).
 */
import workerpool from 'workerpool';
import { type MonteCarloJob, runMonteCarloJob } from './job.js';

const PROGRESS_INTERVAL_MS = 20;

function runRange(job: MonteCarloJob): InstanceType<typeof workerpool.Transfer> {
  let last = Date.now();
  let reported = 0;
  const result = runMonteCarloJob(job, {
    onSample(done) {
      const now = Date.now();
      if (now - last >= PROGRESS_INTERVAL_MS) {
        workerpool.workerEmit({ done: done - reported });
        reported = done;
        last = now;
      }
    },
  });
  const total = result.range[1] - result.range[0];
  if (total > reported) workerpool.workerEmit({ done: total - reported });
  // Typed arrays with their buffers moved, not copied: plain JSON arrays of a long range cost more to
  // build, copy and read back than solving a good share of its samples.
  const { parts, buffers } = result.toParts();
  return new workerpool.Transfer(parts, buffers);
}

workerpool.worker({ runRange });
