/**
 * Choosing coupling capacitors for a required bandwidth.
 *
 * Scenario (invented): the preamplifier of a river-monitoring buoy's hydrophone must pass everything
 * above 20 Hz. The hydrophone (600 Ω) is AC-coupled into a 100 kΩ bias resistor returned to a 2.5 V
 * reference; an op-amp stage with a gain of 11 drives a 10 kΩ data-logger input through a second
 * coupling capacitor. Two first-order high-pass corners at the same frequency f_p give a −3 dB
 * frequency of f_p/√(√2 − 1), so each corner goes at 20 Hz·√(√2 − 1) ≈ 12.9 Hz; each capacitor is
 * 1/(2π·R·f_p) rounded up to the E6 series; the AC analysis then confirms the band edge.
 *
 * Run: npx tsx examples/coupling-capacitors.ts
 */
import { acAnalysis, Circuit, formatValue, GROUND, logSweep, operatingPoint } from '../src/index.js';
import { isMain } from './is-main.js';

const SOURCE_RESISTANCE = 600;
const BIAS_RESISTANCE = 100e3;
const LOAD_RESISTANCE = 10e3;
const REQUIRED_EDGE = 20; // Hz

/** The E6 series of preferred values (IEC 60063). */
const E6 = [1, 1.5, 2.2, 3.3, 4.7, 6.8];

/** The smallest E6 value at or above `value`. */
export function roundUpToE6(value: number): number {
  const decade = 10 ** Math.floor(Math.log10(value));
  for (const m of [...E6, 10]) if (m * decade >= value * (1 - 1e-12)) return m * decade;
  return 10 * decade;
}

/** The preamplifier with the two coupling capacitors given. */
export function hydrophonePreamp(inputCapacitor: number, outputCapacitor: number): Circuit {
  return new Circuit()
    .voltageSource('reference', 'vref', GROUND, { dc: 2.5 })
    .voltageSource('hydrophone', 'sensor', GROUND, { ac: '1m' })
    .resistor('Rsource', 'sensor', 'sensor_out', SOURCE_RESISTANCE)
    .capacitor('Cin', 'sensor_out', 'in', inputCapacitor)
    .resistor('Rbias', 'in', 'vref', BIAS_RESISTANCE)
    .opAmp('Ubuffer', { plus: 'in', minus: 'fb', output: 'amp' })
    .resistor('Rfeedback', 'amp', 'fb', '100k')
    .resistor('Rgain', 'fb', 'vref', '10k')
    .capacitor('Cout', 'amp', 'out', outputCapacitor)
    .resistor('Rlogger', 'out', GROUND, LOAD_RESISTANCE);
}

/** What the design found. */
export interface CouplingDesign {
  /** The corner frequency given to each coupling network, in Hz. */
  readonly cornerEach: number;
  /** The exact capacitances the corners call for, in F. */
  readonly required: { readonly input: number; readonly output: number };
  /** The E6 values chosen, in F. */
  readonly chosen: { readonly input: number; readonly output: number };
  /** The low −3 dB edge of the finished preamplifier from the AC analysis, in Hz. */
  readonly lowerEdge: number;
  /** The mid-band gain, in dB. */
  readonly midbandGainDb: number;
}

/** Size both capacitors and check the band edge. */
export function designCouplingCapacitors(): CouplingDesign {
  const cornerEach = REQUIRED_EDGE * Math.sqrt(Math.SQRT2 - 1);
  const required = {
    input: 1 / (2 * Math.PI * (SOURCE_RESISTANCE + BIAS_RESISTANCE) * cornerEach),
    output: 1 / (2 * Math.PI * LOAD_RESISTANCE * cornerEach),
  };
  const chosen = { input: roundUpToE6(required.input), output: roundUpToE6(required.output) };
  const circuit = hydrophonePreamp(chosen.input, chosen.output);
  const ac = acAnalysis(operatingPoint(circuit), { frequencies: logSweep(0.1, 100e3, 200) });
  const gain = ac.magnitudeDb('out', 'sensor');
  const midbandGainDb = gain[ac.frequencies.findIndex((f) => f >= 1e3)]!;
  const edges = ac.cutoffFrequencies('out', 'sensor', { referenceDb: midbandGainDb });
  return { cornerEach, required, chosen, lowerEdge: edges[0]!, midbandGainDb };
}

if (isMain(import.meta.url)) {
  const d = designCouplingCapacitors();
  console.log(`Each corner at ${formatValue(d.cornerEach, 'Hz', { digits: 4 })}`);
  console.log(
    `Cin : needs ${formatValue(d.required.input, 'F', { digits: 3 })}, use ${formatValue(d.chosen.input, 'F')}`,
  );
  console.log(
    `Cout: needs ${formatValue(d.required.output, 'F', { digits: 3 })}, use ${formatValue(d.chosen.output, 'F')}`,
  );
  console.log(
    `Mid-band gain ${d.midbandGainDb.toFixed(2)} dB; lower −3 dB edge ${formatValue(d.lowerEdge, 'Hz', { digits: 4 })}`,
  );
}
