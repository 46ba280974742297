/**
 * Checks of a small-signal response and of a linearity report: a gain or a phase at one analysed
 * frequency, and a junction within its linearity budget.
 */
import type { AcAnalysis, Probe } from '../analysis/ac-analysis.js';
import type { JunctionLinearity, LinearityReport } from '../analysis/linearity.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import { formatValue } from '../values/format.js';
import { type CheckResult, compare } from './check.js';
import type { Tolerance } from './tolerance.js';

/** Where a response is read: the output, an optional input it is taken relative to, and the frequency. */
export interface ResponsePoint {
  /** The output: a node name, `{ node, reference }` or `{ element }`. */
  readonly output: Probe;
  /** The input the output is divided by (a gain); without it the output's own magnitude is used. */
  readonly input?: Probe;
  /** The frequency, in Hz: one of the frequencies the analysis was run at. */
  readonly frequency: number;
}

/** Which junction to judge, and against which budget. */
export interface JunctionBudgetOptions {
  /** The junction (`'pn'`, `'base-emitter'`, `'base-collector'` or `'channel'`); default every junction of the device. */
  readonly junction?: JunctionLinearity['junction'];
  /** The largest error bound accepted (default the report's own budget). */
  readonly budget?: number;
}

function label(probe: Probe): string {
  if (typeof probe === 'string') return `v(${probe})`;
  if ('element' in probe) return `i(${probe.element})`;
  return probe.reference === undefined ? `v(${probe.node})` : `v(${probe.node}, ${probe.reference})`;
}

/** The index of `frequency` among the analysed frequencies (equal to 1 part in 10⁹). */
function frequencyIndex(ac: AcAnalysis, frequency: number): number {
  for (let k = 0; k < ac.frequencies.length; k++) {
    const f = ac.frequencies[k]!;
    if (Math.abs(f - frequency) <= 1e-9 * Math.max(Math.abs(f), Math.abs(frequency))) return k;
  }
  const list = Array.from(ac.frequencies.slice(0, 6), (f) => formatValue(f, 'Hz')).join(', ');
  const more = ac.frequencies.length > 6 ? ', …' : '';
  throw invalidValue(['frequency'], frequency, `one of the analysed frequencies (${list}${more})`);
}

function subjectOf(what: string, at: ResponsePoint): string {
  const ratio = at.input === undefined ? label(at.output) : `${label(at.output)}/${label(at.input)}`;
  return `${what} ${ratio} at ${formatValue(at.frequency, 'Hz')}`;
}

/**
 * The value of a response series at the analysed frequency of `at`, read in the order the errors are
 * reported (frequency, probes, then the expectation, which must be a finite number).
 */
function responseAt(
  ac: AcAnalysis,
  at: ResponsePoint,
  series: () => Float64Array,
  expected: number,
  expectation: string,
): number {
  const k = frequencyIndex(ac, at.frequency);
  const actual = series()[k]!;
  if (typeof expected !== 'number' || !Number.isFinite(expected)) {
    throw invalidValue(['expected'], expected, expectation);
  }
  return actual;
}

const showDb = (value: number): string => `${Number(value.toPrecision(6))} dB`;
const showDegrees = (value: number): string => `${Number(value.toPrecision(6))}°`;

/**
 * Checks a gain (output/input, or the output's own magnitude) in dB at one analysed frequency.
 *
 * @param ac - the AC analysis
 * @param at - output, optional input and frequency
 * @param expectedDb - the expected level, in dB
 * @param tolerance - in dB (`{ absolute: 0.5 }`), or relative to the expected dB value
 * @returns the outcome
 * @throws QuiescentError `invalid-value` for a frequency that was not analysed; `unknown-node`, `unknown-element`
 */
export function checkGain(
  ac: AcAnalysis,
  at: ResponsePoint,
  expectedDb: number,
  tolerance: Tolerance,
): CheckResult {
  const actual = responseAt(
    ac,
    at,
    () => ac.magnitudeDb(at.output, at.input),
    expectedDb,
    'a finite level in dB',
  );
  return compare(
    subjectOf('gain', at),
    actual,
    expectedDb,
    actual - expectedDb,
    tolerance,
    undefined,
    showDb,
  );
}

/**
 * Checks a phase in degrees at one analysed frequency. The difference is taken modulo 360°, so −90°
 * and 270° are the same phase.
 *
 * @param ac - the AC analysis
 * @param at - output, optional input and frequency
 * @param expectedDegrees - the expected phase, in degrees
 * @param tolerance - in degrees (`{ absolute: 2 }`)
 * @returns the outcome
 * @throws QuiescentError `invalid-value` for a frequency that was not analysed; `unknown-node`, `unknown-element`
 */
export function checkPhase(
  ac: AcAnalysis,
  at: ResponsePoint,
  expectedDegrees: number,
  tolerance: Tolerance,
): CheckResult {
  const actual = responseAt(
    ac,
    at,
    () => ac.phaseDegrees(at.output, at.input),
    expectedDegrees,
    'a finite phase in degrees',
  );
  const off = actual - expectedDegrees - 360 * Math.round((actual - expectedDegrees) / 360);
  return compare(subjectOf('phase', at), actual, expectedDegrees, off, tolerance, undefined, showDegrees);
}

/**
 * Checks that a device's junctions (or one of them) stay within a linearity budget: every error bound
 * at most the budget. A failure names the worst junction, its frequency, amplitude and x.
 *
 * @param report - the linearity report
 * @param device - the diode or transistor
 * @param options - one junction only, and a budget other than the report's
 * @returns the outcome
 * @throws QuiescentError `unknown-element` when the report has no such junction (a MOSFET is judged only
 *   in saturation); `invalid-value` for a budget that is not a finite number > 0
 */
export function checkJunctionWithinBudget(
  report: LinearityReport,
  device: string,
  options: JunctionBudgetOptions = {},
): CheckResult {
  const budget = options.budget ?? report.budget;
  if (typeof budget !== 'number' || !Number.isFinite(budget) || budget <= 0) {
    throw invalidValue(['budget'], budget, 'a finite positive error bound (such as 0.1)');
  }
  const candidates = report.junctions.filter(
    (j) => j.device === device && (options.junction === undefined || j.junction === options.junction),
  );
  let worst: JunctionLinearity | undefined;
  for (const j of candidates) if (worst === undefined || j.errorBound > worst.errorBound) worst = j;
  if (worst === undefined) {
    const which = options.junction === undefined ? 'junction' : `${options.junction} junction`;
    throw unknownElement(
      device,
      `the linearity report has no ${which} of it (a MOSFET is judged only in saturation)`,
    );
  }
  const junctions =
    options.junction ?? (candidates.length === 1 ? worst.junction : `worst junction, ${worst.junction}`);
  const plain = (value: number) => String(Number(value.toPrecision(4)));
  // A reverse-biased junction swings many n·Vt with almost no current: say so, and point to the output.
  const reverse = worst.forwardBiased
    ? ''
    : `; it is reverse-biased (${formatValue(worst.bias, 'V', { digits: 3 })}), so its current is too small to matter` +
      (worst.share === undefined
        ? ': judge the output instead, linearity(ac, { output })'
        : `: its share of the output's 2nd harmonic is ${plain(100 * worst.share.second)} %`);
  return {
    pass: worst.errorBound <= budget,
    subject: `linearity of ${device} (${junctions})`,
    expected: `error bound ≤ ${plain(budget)}`,
    actual:
      `${plain(worst.errorBound)} at ${formatValue(worst.frequency, 'Hz')} ` +
      `(amplitude ${formatValue(worst.amplitude, 'V', { digits: 4 })}, x = ${plain(worst.normalized)})${reverse}`,
    expectedValue: budget,
    actualValue: worst.errorBound,
  };
}
