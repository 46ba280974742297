/**
 * What a Monte Carlo run or a worst case reads from each solved circuit: a DC probe (a node voltage
 * or an element current), a numeric field of a device report, or an AC output's magnitude, level or
 * phase at one frequency (with the sources' AC values as given).
 */
import { type AcAnalysis, acAnalysis, type Probe } from '../analysis/ac-analysis.js';
import type { OperatingPoint } from '../analysis/operating-point.js';
import { invalidValue } from '../errors/messages.js';

/** How an AC measure reads its phasor Y: |Y|, 20·log10|Y| (dB), or arg Y in degrees in (−180, 180]. */
export type AcMeasureForm = 'magnitude' | 'magnitude-db' | 'phase-degrees';

/** One quantity read from every solved sample. */
export type Measure =
  | Probe
  | {
      /** A diode or transistor. */
      readonly device: string;
      /** A numeric field of its report: `'ic'`, `'gm'`, `'vbe'`, … */
      readonly field: string;
    }
  | {
      /** The AC output. */
      readonly output: Probe;
      /** The frequency, in Hz. */
      readonly frequency: number;
      /** How the phasor is read. */
      readonly form: AcMeasureForm;
    };

/** A measure sorted by what it needs: the operating point alone, or an AC solve too. */
export type CheckedMeasure =
  | { readonly type: 'probe'; readonly probe: Probe }
  | { readonly type: 'device'; readonly device: string; readonly field: string }
  | { readonly type: 'ac'; readonly output: Probe; readonly frequency: number; readonly form: AcMeasureForm };

/** The measures of a run, checked once, read into a row of numbers per sample. */
export class MeasureSet {
  /** The measure names, in the order given. */
  readonly names: readonly string[];
  /** The measures, checked, in the order of {@link MeasureSet.names}. */
  readonly checked: readonly CheckedMeasure[];
  /** The distinct AC frequencies, and each AC measure's index among them. */
  readonly #frequencies: Float64Array;
  readonly #frequencyIndex: Int32Array;

  constructor(measures: unknown) {
    if (measures === null || typeof measures !== 'object' || Array.isArray(measures)) {
      throw invalidValue(['options', 'measures'], measures, 'an object of named measures');
    }
    const entries = Object.entries(measures as Record<string, unknown>);
    if (entries.length === 0) throw invalidValue(['options', 'measures'], '{}', 'at least one measure');
    this.names = entries.map(([name]) => name);
    this.checked = entries.map(([name, m]) => check(m, ['options', 'measures', name]));
    const frequencies: number[] = [];
    this.#frequencyIndex = new Int32Array(entries.length).fill(-1);
    this.checked.forEach((m, k) => {
      if (m.type !== 'ac') return;
      let at = frequencies.indexOf(m.frequency);
      if (at < 0) at = frequencies.push(m.frequency) - 1;
      this.#frequencyIndex[k] = at;
    });
    this.#frequencies = Float64Array.from(frequencies);
  }

  /** The measures of `op` into `out` (one entry per measure). Throws what the reading throws. */
  read(op: OperatingPoint, out: Float64Array): void {
    let ac: AcAnalysis | null = null;
    if (this.#frequencies.length > 0) ac = acAnalysis(op, { frequencies: this.#frequencies });
    for (let k = 0; k < this.checked.length; k++) {
      const m = this.checked[k]!;
      let value: number;
      if (m.type === 'probe') value = readProbe(op, m.probe);
      else if (m.type === 'device') value = readField(op, m.device, m.field, this.names[k]!);
      else value = readAc(ac!, m, this.#frequencyIndex[k]!);
      if (!Number.isFinite(value)) {
        throw invalidValue(['options', 'measures', this.names[k]!], value, 'a finite measured value');
      }
      out[k] = value;
    }
  }
}

function check(m: unknown, path: (string | number)[]): CheckedMeasure {
  if (typeof m === 'string') return { type: 'probe', probe: m };
  if (m !== null && typeof m === 'object') {
    const o = m as Record<string, unknown>;
    if (typeof o.device === 'string' && typeof o.field === 'string') {
      return { type: 'device', device: o.device, field: o.field };
    }
    if ('output' in o) {
      const f = o.frequency;
      if (typeof f !== 'number' || !Number.isFinite(f) || f < 0) {
        throw invalidValue([...path, 'frequency'], f, 'a frequency of 0 Hz or more');
      }
      if (o.form !== 'magnitude' && o.form !== 'magnitude-db' && o.form !== 'phase-degrees') {
        throw invalidValue([...path, 'form'], o.form, "'magnitude', 'magnitude-db' or 'phase-degrees'");
      }
      return { type: 'ac', output: o.output as Probe, frequency: f, form: o.form };
    }
    if (typeof o.node === 'string' || typeof o.element === 'string')
      return { type: 'probe', probe: o as Probe };
  }
  throw invalidValue(
    path,
    m,
    'a probe (a node name, { node, reference? } or { element }), { device, field } or { output, frequency, form }',
  );
}

function readProbe(op: OperatingPoint, probe: Probe): number {
  if (typeof probe === 'string') return op.voltage(probe);
  if ('element' in probe) return op.current(probe.element);
  return op.voltage(probe.node, probe.reference);
}

function readField(op: OperatingPoint, device: string, field: string, name: string): number {
  const value = (op.device(device) as unknown as Record<string, unknown>)[field];
  if (typeof value !== 'number') {
    throw invalidValue(
      ['options', 'measures', name, 'field'],
      field,
      `a numeric field of the report of '${device}'`,
    );
  }
  return value;
}

function readAc(ac: AcAnalysis, m: Extract<CheckedMeasure, { type: 'ac' }>, at: number): number {
  const y = ac.response(m.output)[at]!;
  if (m.form === 'phase-degrees') return (Math.atan2(y.im, y.re) * 180) / Math.PI;
  const magnitude = Math.hypot(y.re, y.im);
  if (m.form === 'magnitude') return magnitude;
  if (magnitude === 0) {
    throw invalidValue(
      ['output'],
      m.output,
      `an output carrying signal at ${m.frequency} Hz (its phasor is 0)`,
    );
  }
  return 20 * Math.log10(magnitude);
}
