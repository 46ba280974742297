/**
 * The peak memory of one pipeline case, as a user's process has it: one pass (build the circuit, its
 * operating point, a two-frequency AC analysis and its linearity report), then the process's peak
 * resident memory in MB on stdout. bench/pipeline.ts bundles this file with the library's sources
 * and runs the bundle on plain Node, as the built package runs: under the TypeScript loader the
 * same pass would also count the loader and the sources it keeps (about 50 MB more).
 *
 * Run through bench/pipeline.ts; alone: node <bundle> <family>:<elements>
 */
import { acAnalysis, linearity, operatingPoint } from '../src/index.js';
import { PIPELINE_FAMILIES, type PipelineFamily, pipelineCircuit } from './pipeline-circuits.js';

/** The frequency of the pass's AC analysis, in Hz (as bench/pipeline.ts's). */
const FREQUENCY = 1e3;

const [family, size] = (process.argv[2] ?? '').split(':');
if (!PIPELINE_FAMILIES.includes(family as PipelineFamily) || !(Number(size) > 0)) {
  throw new Error(
    `expected <family>:<elements>, one of ${PIPELINE_FAMILIES.join(', ')}; got '${process.argv[2]}'`,
  );
}
const { circuit } = pipelineCircuit(family as PipelineFamily, Number(size));
const op = operatingPoint(circuit);
linearity(acAnalysis(op, { frequencies: [FREQUENCY, 2 * FREQUENCY] }));
console.log(process.resourceUsage().maxRSS / 1024);
