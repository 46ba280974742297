/**
 * The worker side of a Monte Carlo pool: runs one job (a range of samples) and returns its result as
 * typed arrays (their buffers transferred), reporting progress as samples finish (at most every
 * 20 ms, and at the end).
 */
import workerpool from 'workerpool';
import { JobRun, JobSetUp, type MonteCarloJob, runJob, setUpKey } from './job.js';

const PROGRESS_INTERVAL_MS = 20;

/**
 * The set-up of the last run this worker served: the ranges of one run (several per worker, and the
 * runs repeated on kept workers) compile the circuit and solve its nominal point once.
 */
let kept: { readonly key: string; readonly setUp: JobSetUp } | null = null;

function runRange(job: MonteCarloJob): InstanceType<typeof workerpool.Transfer> {
  const key = setUpKey(job);
  if (kept?.key !== key) {
    kept = null; // the previous run's set-up can go before the next is built
    kept = { key, setUp: new JobSetUp(job) };
  }
  let last = Date.now();
  let reported = 0;
  const result = runJob(new JobRun(job, kept.setUp), {
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
