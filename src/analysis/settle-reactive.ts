/**
 * The periodic steady state of held reactive elements. A large coupling capacitor holds a constant
 * voltage over a period, but not necessarily its operating-point voltage: once the signal has run long
 * enough, its charge balances, so its mean current over the period is zero. Likewise an inductor's
 * mean voltage. When the nonlinearity shifts the mean currents, the held values move by as much as it
 * takes to bring every mean back to zero; that is the DC shift the circuit settles to, the one the
 * distortion estimate finds by taking DC with the capacitors open.
 *
 * The held offsets u solve m(u) = 0, m being the period means. m is nearly affine in u (the circuit is
 * nearly linear in the offsets), so a chord iteration with the Jacobian of the quiescent circuit,
 * J = ∂q/∂u by central differences on 2k operating points, converges in a few periods. The cost is a
 * few periods plus 2k solves: still linear in the number of phases.
 */
import type { QuasiStaticDriver } from './quasi-static.js';

/** Periods at most before the iteration stops. */
const MAX_PERIODS = 8;
/** Relative change of the offsets below which they count as settled. */
const SETTLED = 1e-10;

/**
 * Move every held element to the value at which its quantity averages to zero over `period`.
 *
 * @param driver - the prepared large-signal circuit, its held elements at their operating-point values
 * @param period - runs one period (or grid) of solves through `driver.solve`
 * @param count - the number of solves in one period
 */
export function settleHeld(driver: QuasiStaticDriver, period: () => void, count: number): void {
  const held = driver.heldElements;
  const k = held.length;
  if (k === 0) return;
  const u = new Float64Array(k);
  const still = new Float64Array(driver.drives.length);
  const step = Float64Array.from(held, (h) => 1e-4 * Math.max(Math.abs(h.dc), h.capacitor ? 1e-2 : 1e-6));
  // J[i][j] = ∂(quantity i)/∂(offset j) at the quiescent point, by central differences.
  const jacobian = Array.from({ length: k }, () => new Float64Array(k));
  const quantities = (): Float64Array => {
    driver.heldSums.fill(0);
    driver.setHeld(u);
    driver.solve(still);
    return driver.heldSums.slice();
  };
  for (let j = 0; j < k; j++) {
    u[j] = step[j]!;
    const up = quantities();
    u[j] = -step[j]!;
    const down = quantities();
    u[j] = 0;
    for (let i = 0; i < k; i++) jacobian[i]![j] = (up[i]! - down[i]!) / (2 * step[j]!);
  }
  const factors = luFactor(jacobian);
  driver.setHeld(u);
  for (let iteration = 0; iteration < MAX_PERIODS; iteration++) {
    driver.heldSums.fill(0);
    period();
    const mean = Float64Array.from(driver.heldSums, (sum) => sum / count);
    const delta = luSolve(factors, mean);
    let settled = true;
    for (let j = 0; j < k; j++) {
      u[j]! -= delta[j]!;
      if (Math.abs(delta[j]!) > SETTLED * Math.max(Math.abs(held[j]!.dc) + Math.abs(u[j]!), step[j]!))
        settled = false;
    }
    driver.setHeld(u);
    if (settled) break;
  }
}

/** A small dense LU with partial pivoting; a column without a usable pivot keeps its offset (row and column dropped). */
interface DenseLu {
  readonly a: Float64Array[];
  readonly pivot: Int32Array;
  readonly usable: Uint8Array;
}

function luFactor(matrix: readonly Float64Array[]): DenseLu {
  const k = matrix.length;
  const a = matrix.map((row) => row.slice());
  const pivot = new Int32Array(k);
  const usable = new Uint8Array(k);
  let largest = 0;
  for (const row of a) for (const v of row) largest = Math.max(largest, Math.abs(v));
  for (let c = 0; c < k; c++) {
    let p = c;
    for (let r = c + 1; r < k; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[p]![c]!)) p = r;
    pivot[c] = p;
    [a[c], a[p]] = [a[p]!, a[c]!];
    if (!(Math.abs(a[c]![c]!) > 1e-12 * largest)) continue;
    usable[c] = 1;
    for (let r = c + 1; r < k; r++) {
      const f = a[r]![c]! / a[c]![c]!;
      a[r]![c] = f;
      for (let j = c + 1; j < k; j++) a[r]![j]! -= f * a[c]![j]!;
    }
  }
  return { a, pivot, usable };
}

function luSolve({ a, pivot, usable }: DenseLu, rhs: Float64Array): Float64Array {
  const k = a.length;
  const x = rhs.slice();
  for (let c = 0; c < k; c++) {
    const p = pivot[c]!;
    [x[c], x[p]] = [x[p]!, x[c]!];
    if (!usable[c]) continue;
    for (let r = c + 1; r < k; r++) x[r]! -= a[r]![c]! * x[c]!;
  }
  for (let c = k - 1; c >= 0; c--) {
    if (!usable[c]) {
      x[c] = 0;
      continue;
    }
    let v = x[c]!;
    for (let j = c + 1; j < k; j++) v -= a[c]![j]! * x[j]!;
    x[c] = v / a[c]![c]!;
  }
  return x;
}
