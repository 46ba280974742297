// The queue example end to end against a real Redis server on the loopback address (started and
// stopped by the example): the parts computed by queue workers merge into one local run's result.
import assert from 'node:assert/strict';
import { test } from 'node:test';
import { runDistributed, sameResult } from './run.mjs';

test('a Monte Carlo run spread over BullMQ workers equals one local run, bit for bit', async () => {
  const { merged, local } = await runDistributed({ workers: 3, ranges: 8 });
  assert.deepEqual(merged.range, [0, 2000]);
  assert.equal(merged.sampleIndex.length + merged.failures.length, 2000);
  assert.ok(sameResult(merged, local));
  assert.deepEqual(merged.summary, local.summary);
});
