/**
 * The MOSFET channel from weak through moderate to strong inversion: the charge-based model of
 * C. C. Enz, F. Krummenacher and E. A. Vittoz ("An analytical MOS transistor model valid in all
 * regions of operation and dedicated to low-voltage and low-current applications", Analog
 * Integrated Circuits and Signal Processing 8, 1995) in its constant-slope-factor form.
 *
 * In the mirrored frame (nmos voltages; a pmos uses vsg, vsd, vsb and |Vth0|), every voltage referred
 * to the body (vg = vgs − vbs, vs = −vbs, vd = vds − vbs):
 *   Vp = (vg − Vth0)/n,
 *   if = F((Vp − vs)/(2·Vt)), ir = F((Vp − vd)/(2·Vt)),  F(a) = ln²(1 + e^a),
 *   id = 2·n·β·Vt²·(if − ir)·(1 + λ·|vds|).
 * With the source at the body, strong inversion and saturation give id → β/(2n)·(vgs − Vth0)², and
 * weak inversion gives id → 2nβVt²·e^((vgs − Vth0)/(n·Vt)), so g_m/I_D → 1/(n·Vt).
 *
 * The functions here are pure, so the device, its tests and the fitting routines share one copy.
 */

/** The constants of one channel at the analysis conditions, in the mirrored frame. */
export interface ChargeModelConstants {
  /** |Vth0| at the analysis temperature, in V. */
  readonly thresholdVoltage: number;
  /** β = μ·Cox·W/L at the analysis temperature, in A/V². */
  readonly gainFactor: number;
  /** n, the slope factor (greater than 1). */
  readonly slopeFactor: number;
  /** λ, in 1/V. */
  readonly channelLengthModulation: number;
  /** k·T/q, in V. */
  readonly thermalVoltage: number;
}

/** Below this forward inversion coefficient the channel is in weak inversion. */
export const WEAK_INVERSION_LIMIT = 0.1;
/** Above this forward inversion coefficient the channel is in strong inversion. */
export const STRONG_INVERSION_LIMIT = 10;

/** The inversion level of a channel, from its forward inversion coefficient. */
export type InversionLevel = 'weak' | 'moderate' | 'strong';

/** `'weak'` below if = 0.1, `'strong'` above if = 10, else `'moderate'`. */
export function inversionLevel(forwardCoefficient: number): InversionLevel {
  if (forwardCoefficient < WEAK_INVERSION_LIMIT) return 'weak';
  return forwardCoefficient > STRONG_INVERSION_LIMIT ? 'strong' : 'moderate';
}

/**
 * F(a) = ln²(1 + e^a) and its first three derivatives, written to out[0 … 3]: with ℓ = ln(1 + e^a)
 * and σ = 1/(1 + e^−a) (so ℓ' = σ, σ' = σ·(1 − σ)):
 *   F' = 2ℓσ, F'' = 2σ² + 2ℓσ(1 − σ), F''' = 6σ²(1 − σ) + 2ℓσ(1 − σ)(1 − 2σ).
 * Finite on the whole real line (ℓ and σ are formed without overflow).
 */
export function inversionFunction(a: number, out: Float64Array): Float64Array {
  const ea = Math.exp(-Math.abs(a));
  const l = a > 0 ? a + Math.log1p(ea) : Math.log1p(ea);
  const sigma = a >= 0 ? 1 / (1 + ea) : ea / (1 + ea);
  const rest = a >= 0 ? ea / (1 + ea) : 1 / (1 + ea); // 1 − σ without cancellation
  out[0] = l * l;
  out[1] = 2 * l * sigma;
  out[2] = 2 * sigma * sigma + 2 * l * sigma * rest;
  out[3] = 6 * sigma * sigma * rest + 2 * l * sigma * rest * (rest - sigma);
  return out;
}

// Scratch of the evaluations below (F and its derivatives at a_f and a_r), so that none allocates.
const forward = new Float64Array(4);
const reverse = new Float64Array(4);

/** F and its derivatives at a_f = (Vp − vs)/(2Vt) into `forward` and at a_r = (Vp − vd)/(2Vt) into `reverse`. */
function evaluateInversion(vgs: number, vds: number, vbs: number, c: ChargeModelConstants): void {
  const twoVt = 2 * c.thermalVoltage;
  const pinchOff = (vgs - vbs - c.thresholdVoltage) / c.slopeFactor;
  inversionFunction((pinchOff + vbs) / twoVt, forward);
  inversionFunction((pinchOff - vds + vbs) / twoVt, reverse);
}

/**
 * The channel current and its first derivatives at mirrored (vgs, vds, vbs), written to
 * out = [id, ∂id/∂vgs, ∂id/∂vds, ∂id/∂vbs, if, ir]. Returns out.
 */
export function chargeBasedChannel(
  vgs: number,
  vds: number,
  vbs: number,
  c: ChargeModelConstants,
  out: Float64Array,
): Float64Array {
  const n = c.slopeFactor;
  const vt = c.thermalVoltage;
  evaluateInversion(vgs, vds, vbs, c);
  const k = 2 * n * c.gainFactor * vt * vt;
  const m = 1 + c.channelLengthModulation * Math.abs(vds);
  const dm = c.channelLengthModulation * Math.sign(vds);
  const d = forward[0]! - reverse[0]!;
  // ∂a_f/∂vgs = ∂a_r/∂vgs = 1/(2nVt); ∂a_r/∂vds = −1/(2Vt); ∂a/∂vbs = (1 − 1/n)/(2Vt) for both.
  const slope = (forward[1]! - reverse[1]!) / (2 * vt);
  out[0] = k * d * m;
  out[1] = (k * m * slope) / n;
  out[2] = (k * m * reverse[1]!) / (2 * vt) + k * d * dm;
  out[3] = k * m * slope * (1 - 1 / n);
  out[4] = forward[0]!;
  out[5] = reverse[0]!;
  return out;
}

/**
 * The second and third partial derivatives of id in the mirrored controls (vgs, vds, vbs), exact:
 * id = K·m·(F(a_f) − F(a_r)) with a_f, a_r linear in the controls (coefficients c_f, c_r above) and
 * m = 1 + λ·|vds| linear in vds away from 0, so
 *   ∂²id/∂x_i∂x_j = K·(m·D_ij + m_i·D_j + m_j·D_i),
 *   ∂³id/∂x_i∂x_j∂x_k = K·(m·D_ijk + m_i·D_jk + m_j·D_ik + m_k·D_ij),
 * with D_i… = F^(k)(a_f)·c_f,i… − F^(k)(a_r)·c_r,i…. `second` (3×3) and `third` (3×3×3) are row-major.
 */
export function chargeBasedCurvature(
  vgs: number,
  vds: number,
  vbs: number,
  c: ChargeModelConstants,
  second: number[],
  third: number[],
): void {
  const n = c.slopeFactor;
  const twoVt = 2 * c.thermalVoltage;
  evaluateInversion(vgs, vds, vbs, c);
  const k = n * c.gainFactor * c.thermalVoltage * twoVt;
  const m = 1 + c.channelLengthModulation * Math.abs(vds);
  const dm = [0, c.channelLengthModulation * Math.sign(vds), 0];
  const cf = [1 / (n * twoVt), 0, (1 - 1 / n) / twoVt];
  const cr = [1 / (n * twoVt), -1 / twoVt, (1 - 1 / n) / twoVt];
  const d1 = (i: number): number => forward[1]! * cf[i]! - reverse[1]! * cr[i]!;
  const d2 = (i: number, j: number): number => forward[2]! * cf[i]! * cf[j]! - reverse[2]! * cr[i]! * cr[j]!;
  const d3 = (i: number, j: number, l: number): number =>
    forward[3]! * cf[i]! * cf[j]! * cf[l]! - reverse[3]! * cr[i]! * cr[j]! * cr[l]!;
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) {
      second[i * 3 + j] = k * (m * d2(i, j) + dm[i]! * d1(j) + dm[j]! * d1(i));
      for (let l = 0; l < 3; l++) {
        third[i * 9 + j * 3 + l] =
          k * (m * d3(i, j, l) + dm[i]! * d2(j, l) + dm[j]! * d2(i, l) + dm[l]! * d2(i, j));
      }
    }
  }
}
