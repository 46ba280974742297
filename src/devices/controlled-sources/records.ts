/** The element records of the four controlled sources: plain checked data, numbers in SI units. */

/** A voltage-controlled voltage source. */
export interface VcvsRecord {
  /** Always `'vcvs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'vcvs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The positive output node. */
  readonly outPlus: string;
  /** The negative output node. */
  readonly outMinus: string;
  /** The positive controlling node. */
  readonly controlPlus: string;
  /** The negative controlling node. */
  readonly controlMinus: string;
  /** Voltage gain: v(out) = gain · v(control). */
  readonly gain: number;
}

/** A voltage-controlled current source. */
export interface VccsRecord {
  /** Always `'vccs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'vccs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The output node the current is drawn from. */
  readonly outFrom: string;
  /** The output node the current is delivered into. */
  readonly outTo: string;
  /** The positive controlling node. */
  readonly controlPlus: string;
  /** The negative controlling node. */
  readonly controlMinus: string;
  /** Transconductance in S: gm·v(control) flows from `outFrom` through the source into `outTo`. */
  readonly transconductance: number;
}

/** A current-controlled voltage source. */
export interface CcvsRecord {
  /** Always `'ccvs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'ccvs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The positive output node. */
  readonly outPlus: string;
  /** The negative output node. */
  readonly outMinus: string;
  /** The element whose current controls the source (a voltage source, inductor, vcvs, ccvs or loop probe). */
  readonly control: string;
  /** Transresistance in Ω: v(out) = transresistance · i(control). */
  readonly transresistance: number;
}

/** A current-controlled current source. */
export interface CccsRecord {
  /** Always `'cccs'`; narrows an {@link ElementRecord}. */
  readonly kind: 'cccs';
  /** The element name, unique within the circuit. */
  readonly name: string;
  /** The output node the current is drawn from. */
  readonly outFrom: string;
  /** The output node the current is delivered into. */
  readonly outTo: string;
  /** The element whose current controls the source (a voltage source, inductor, vcvs, ccvs or loop probe). */
  readonly control: string;
  /** Current gain: the output current is gain · i(control). */
  readonly gain: number;
}
