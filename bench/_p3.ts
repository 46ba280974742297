import { operatingPoint } from '../src/index.js';
import { pipelineCircuit } from './pipeline-circuits.js';
const { circuit } = pipelineCircuit('mesh', 10000);
let op = operatingPoint(circuit);
for (let r = 0; r < 3; r++) op = operatingPoint(circuit);
const t0 = performance.now();
for (let r = 0; r < 20; r++) op = operatingPoint(circuit);
console.log('repeated op ms', (performance.now() - t0) / 20, op.iterations);
