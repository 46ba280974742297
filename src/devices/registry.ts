/** From element record to compiled device: the one place that knows every kind. */
import type { ElementRecord } from '../circuit/elements.js';
import { Bjt } from './bjt.js';
import { Capacitor } from './capacitor.js';
import { Cccs, Ccvs, Vccs, Vcvs } from './controlled-sources.js';
import { CurrentSource } from './current-source.js';
import type { Device } from './device.js';
import { Diode } from './diode.js';
import { Inductor } from './inductor.js';
import { LoopProbe } from './loop-probe.js';
import { Mosfet } from './mosfet.js';
import { OpAmp } from './op-amp.js';
import { Resistor } from './resistor.js';
import { VoltageSource } from './voltage-source.js';

/** Build the compiled device of an element record. */
export function createDevice(record: ElementRecord): Device {
  switch (record.kind) {
    case 'resistor':
      return new Resistor(record);
    case 'capacitor':
      return new Capacitor(record);
    case 'inductor':
      return new Inductor(record);
    case 'voltage-source':
      return new VoltageSource(record);
    case 'current-source':
      return new CurrentSource(record);
    case 'vcvs':
      return new Vcvs(record);
    case 'vccs':
      return new Vccs(record);
    case 'ccvs':
      return new Ccvs(record);
    case 'cccs':
      return new Cccs(record);
    case 'loop-probe':
      return new LoopProbe(record);
    case 'op-amp':
      return new OpAmp(record);
    case 'diode':
      return new Diode(record);
    case 'bjt':
      return new Bjt(record);
    case 'mosfet':
      return new Mosfet(record);
  }
}
