/**
 * Test circuits of the linearity tests, each named by its role. Values are ordinary small-signal
 * designs (common practice, no source).
 */
import { Circuit, GROUND } from '../../src/index.js';

/** One diode driven straight by a voltage source of `amplitude` volts peak on 0.6 V. */
export function singleJunction(amplitude: number): Circuit {
  return new Circuit()
    .voltageSource('drive', 'a', GROUND, { dc: 0.6, ac: amplitude })
    .diode('D1', 'a', GROUND);
}

/** The bias through R into a diode of test/reference/diode-harmonics.py (r_d ≈ 16 Ω against R = 20 Ω). */
export function diodeAttenuator(
  reference: { bias: number; resistance: number; saturationCurrent: number },
  amplitude: number,
): Circuit {
  return new Circuit()
    .voltageSource('drive', 'in', GROUND, { dc: reference.bias, ac: amplitude })
    .resistor('source', 'in', 'a', reference.resistance)
    .diode('D1', 'a', GROUND, { saturationCurrent: reference.saturationCurrent });
}

/**
 * A divider-biased common-emitter stage on 12 V: coupling capacitors in and out, an emitter resistor of
 * `degeneration` ohms (none for 0) in series with a bypassed 1 kΩ, `amplitude` volts peak at the input.
 */
export function commonEmitterStage(amplitude: number, degeneration: number): Circuit {
  const emitter = degeneration > 0 ? 'emitter' : 'tail';
  const c = new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .voltageSource('signal', 'in', GROUND, { ac: amplitude })
    .capacitor('Cin', 'in', 'base', '100µ')
    .resistor('Rtop', 'vcc', 'base', '47k')
    .resistor('Rbottom', 'base', GROUND, '10k')
    .resistor('Rcollector', 'vcc', 'collector', '3.3k')
    .resistor('Rbias', 'tail', GROUND, '1k')
    .capacitor('Cbypass', 'tail', GROUND, '1000µ')
    .bjt(
      'Q1',
      { collector: 'collector', base: 'base', emitter },
      {
        polarity: 'npn',
        forwardBeta: 200,
        earlyVoltage: 80,
      },
    )
    .capacitor('Cout', 'collector', 'out', '100µ')
    .resistor('Rload', 'out', GROUND, '47k');
  return degeneration > 0 ? c.resistor('Rdegeneration', 'emitter', 'tail', degeneration) : c;
}

/** A DC-coupled common-source stage with channel-length modulation, `amplitude` volts peak at the gate. */
export function commonSourceStage(amplitude: number): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
    .voltageSource('gate', 'g', GROUND, { dc: 1.7, ac: amplitude })
    .resistor('Rdrain', 'vdd', 'd', '5k')
    .mosfet(
      'amplifier',
      { drain: 'd', gate: 'g', source: GROUND },
      { polarity: 'nmos', channelLengthModulation: 0.05 },
    );
}

/**
 * A diode voltage-controlled attenuator, DC-coupled: 50 mV peak through 4.7 kΩ into a shunt diode whose
 * bias the control voltage sets through 22 kΩ.
 */
export function diodeLevelControl(control: number): Circuit {
  return new Circuit()
    .voltageSource('audio', 'in', GROUND, { ac: 0.05 })
    .resistor('Rseries', 'in', 'shunt', '4.7k')
    .diode('Dshunt', 'shunt', GROUND, { saturationCurrent: 2e-9, emissionCoefficient: 1.9 })
    .voltageSource('control', 'control', GROUND, { dc: control })
    .resistor('Rcontrol', 'control', 'shunt', '22k');
}
