/**
 * The built-in example: the front end of an invented greenhouse leaf-wetness sensor. A common-emitter
 * stage amplifies the electrode signal; a diode pair, biased by a control current, sets the level
 * that reaches the detector. This script solves its operating point and prints every device.
 */
import { Circuit, formatValue, GROUND, operatingPoint } from '../src/index.js';

export function leafWetnessFrontEnd(): Circuit {
  return new Circuit()
    .voltageSource('Vsupply', 'vcc', GROUND, { dc: '9 V' })
    .voltageSource('Vsensor', 'electrode', GROUND, { dc: 0, ac: '1m' })
    .capacitor('Cin', 'electrode', 'base', '1µF')
    .resistor('Rtop', 'vcc', 'base', '82k')
    .resistor('Rbottom', 'base', GROUND, '15k')
    .resistor('Rcollector', 'vcc', 'collector', '4.7k')
    .resistor('Remitter', 'emitter', GROUND, '1k')
    .capacitor('Cbypass', 'emitter', GROUND, '47µF')
    .bjt(
      'Qamp',
      { collector: 'collector', base: 'base', emitter: 'emitter' },
      {
        polarity: 'npn',
        forwardBeta: 150,
        earlyVoltage: 80,
        baseEmitterCapacitance: '12p',
        baseCollectorCapacitance: '4p',
        forwardTransitTime: '0.4n',
      },
    )
    .capacitor('Cout', 'collector', 'level', '2.2µF')
    .resistor('Rlevel', 'level', GROUND, '10k')
    .currentSource('Icontrol', 'vcc', 'shunt', { dc: '200µ' })
    .resistor('Rshunt', 'shunt', 'detector', '100k')
    .resistor('Rfeed', 'level', 'detector', '2.2k')
    .diode('Dlevel', 'detector', GROUND, {
      saturationCurrent: '4n',
      emissionCoefficient: 1.8,
      junctionCapacitance: '2p',
    });
}

const op = operatingPoint(leafWetnessFrontEnd());
console.log(`Operating point (${op.strategy}, ${op.iterations} iterations, T = ${op.temperature} K)`);
for (const node of op.nodes) console.log(`  v(${node})`.padEnd(18), formatValue(op.voltage(node), 'V'));
const q = op.bjt('Qamp');
console.log(
  `  Qamp ${q.region}: ic ${formatValue(q.ic, 'A')}, gm ${formatValue(q.gm, 'S')}, rpi ${formatValue(q.rpi, 'Ω')}, ro ${formatValue(q.ro, 'Ω')}`,
);
const d = op.diode('Dlevel');
console.log(`  Dlevel: i ${formatValue(d.current, 'A')}, r_d ${formatValue(d.resistance, 'Ω')}`);
