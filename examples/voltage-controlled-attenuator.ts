/**
 * The attenuation of a voltage-controlled attenuator against its control voltage.
 *
 * Scenario (invented): the audio output of a hobbyist's bat detector needs a level control driven by
 * a microcontroller's 0–10 V output. The signal passes through 4.7 kΩ into a shunt diode; the control
 * voltage drives the diode's bias current through 22 kΩ. The diode's dynamic resistance
 * r_d = n·Vt/I_D falls as the control rises, so the divider attenuates more. A DC sweep of the control
 * voltage gives the operating point at each setting, and an AC analysis at 1 kHz at each point gives
 * the attenuation there, and the linearity verdict at the output: the diode is most curved where it
 * barely conducts, yet there the series resistor sets the output and its curvature hardly reaches it,
 * so the verdict is taken at the shunt node, not at the junction (docs/linearity.md).
 *
 * Run: npx tsx examples/voltage-controlled-attenuator.ts
 */
import {
  acAnalysis,
  Circuit,
  dcSweep,
  formatValue,
  GROUND,
  linearity,
  linearSweep,
  renderTable,
} from '../src/index.js';
import { isMain } from './is-main.js';

/** The attenuator's parts, exported for the checks. */
export const ATTENUATOR = {
  seriesResistance: 4.7e3,
  controlResistance: 22e3,
  saturationCurrent: 2e-9,
  emissionCoefficient: 1.9,
} as const;

/** The attenuator with its control source at 0 V (the sweep sets it). */
export function batDetectorAttenuator(): Circuit {
  return new Circuit()
    .voltageSource('audio', 'audio', GROUND, { ac: '50m' })
    .capacitor('Cin', 'audio', 'feed', '10µ')
    .resistor('Rseries', 'feed', 'shunt', ATTENUATOR.seriesResistance)
    .diode('Dshunt', 'shunt', GROUND, {
      saturationCurrent: ATTENUATOR.saturationCurrent,
      emissionCoefficient: ATTENUATOR.emissionCoefficient,
    })
    .voltageSource('control', 'control', GROUND, { dc: 0 })
    .resistor('Rcontrol', 'control', 'shunt', ATTENUATOR.controlResistance);
}

/** One setting of the control: its voltage, the diode's bias and the attenuation at 1 kHz. */
export interface AttenuatorSetting {
  /** The control voltage, in V. */
  readonly control: number;
  /** The diode's bias current, in A. */
  readonly diodeCurrent: number;
  /** The diode's dynamic resistance, in Ω. */
  readonly dynamicResistance: number;
  /** Output over input at 1 kHz, in dB (negative: attenuation). */
  readonly gainDb: number;
  /** The output's 2nd harmonic over its fundamental at 1 kHz (method of nonlinear currents). */
  readonly secondHarmonic: number;
  /** The output's error bound at 1 kHz, and whether it is within the default budget of 0.1. */
  readonly errorBound: number;
  readonly linear: boolean;
}

/** Sweep the control from 0.5 V to 10 V and take the 1 kHz gain at each setting. */
export function attenuationCurve(count = 20): AttenuatorSetting[] {
  const controls = linearSweep(0.5, 10, count);
  const sweep = dcSweep(batDetectorAttenuator(), { source: 'control', values: controls });
  return sweep.points.map((op, k) => {
    const diode = op.diode('Dshunt');
    const ac = acAnalysis(op, { frequencies: [1e3] });
    const verdict = linearity(ac, { output: 'shunt' });
    return {
      control: controls[k]!,
      diodeCurrent: diode.current,
      dynamicResistance: diode.resistance,
      gainDb: ac.magnitudeDb('shunt', 'audio')[0]!,
      secondHarmonic: verdict.output!.secondHarmonic,
      errorBound: verdict.output!.errorBound,
      linear: verdict.withinBudget,
    };
  });
}

if (isMain(import.meta.url)) {
  const rows = attenuationCurve(11).map((s) => [
    formatValue(s.control, 'V', { digits: 3 }),
    formatValue(s.diodeCurrent, 'A', { digits: 3 }),
    formatValue(s.dynamicResistance, 'Ω', { digits: 3 }),
    `${s.gainDb.toFixed(2)} dB`,
    `${(100 * s.secondHarmonic).toFixed(3)} %`,
    s.errorBound.toPrecision(3),
    s.linear ? 'linear enough' : 'not linear enough',
  ]);
  console.log(
    renderTable({
      title: 'Bat-detector level control at 1 kHz (50 mV in), verdict at the shunt node',
      columns: [
        { header: 'control', align: 'right' },
        { header: 'diode bias', align: 'right' },
        { header: 'r_d', align: 'right' },
        { header: 'gain', align: 'right' },
        { header: '2nd harm. at output', align: 'right' },
        { header: 'error bound', align: 'right' },
        { header: 'verdict' },
      ],
      rows,
    }),
  );
}
