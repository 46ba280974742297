import { Circuit, GROUND, operatingPoint, prepareCircuit } from '../src/index.js';

const r = [3126.2653453336598, 735.6988792289802, 99999.91459003456];
const c = new Circuit()
  .voltageSource('supply', 'a', GROUND, { dc: 0.5 })
  .resistor('r0', 'a', 'b', r[0]!)
  .diode('d0', 'b', 'c', { saturationCurrent: 1e-15 })
  .resistor('r1', 'c', GROUND, r[1]!)
  .resistor('r2', 'b', GROUND, r[2]!);
const T = { relativeTolerance: 1e-9, voltageTolerance: 1e-12, currentTolerance: 1e-15 };
operatingPoint(c);
const p = prepareCircuit(c);
for (const v of [r[0]! * (1 + 1e-4), r[0]! * (1 - 1e-4)]) {
  p.setValue('r0', 'resistance', v);
  try {
    const op = p.operatingPoint(T);
    console.log(op.iterations, op.voltage('c'));
  } catch (e) {
    console.log((e as Error).message.slice(0, 60), (e as any).details.lastUpdateNorm);
  }
}
const q = prepareCircuit(c);
q.setValue('r0', 'resistance', r[0]! * (1 + 1e-4));
try {
  const op = q.operatingPoint(T);
  console.log('fresh', op.iterations);
} catch (e) {
  console.log('fresh fail');
}
const c2 = new Circuit()
  .voltageSource('supply', 'a', GROUND, { dc: 0.5 })
  .resistor('r0', 'a', 'b', r[0]! * (1 + 1e-4))
  .diode('d0', 'b', 'c', { saturationCurrent: 1e-15 })
  .resistor('r1', 'c', GROUND, r[1]!)
  .resistor('r2', 'b', GROUND, r[2]!);
try {
  const op = operatingPoint(c2, T);
  console.log('new circuit', op.iterations);
} catch (e) {
  console.log('new circuit fail');
}
