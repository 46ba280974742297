import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { acAnalysis, Circuit, GROUND, linearity, type MosfetModel, operatingPoint } from '../../src/index.js';
import reference from '../reference/mosfet-charge.json';
import { expectRelativelyClose } from '../support/close.js';

/** Element values below 1e-60 are refused at the boundary (docs/analyses.md, "Arguments"): draw 0 instead. */
const noSubnormal = (v: number): number => (Math.abs(v) < 1e-30 ? 0 : v);

const T = 300.15;
const BARE = { temperature: T, junctionConductance: 1e-30 };
const MODEL = {
  polarity: 'nmos' as const,
  slopeFactor: reference.slopeFactor,
  gainFactor: reference.gainFactor,
  thresholdVoltage: reference.thresholdVoltage,
  channelLengthModulation: reference.channelLengthModulation,
};

/** One transistor with its gate, drain and body held by sources (the source grounded). */
function biased(vgs: number, vds: number, vbs: number, model: MosfetModel = MODEL, polarity = 1) {
  return new Circuit()
    .voltageSource('gateDrive', 'g', GROUND, { dc: polarity * vgs })
    .voltageSource('drainDrive', 'd', GROUND, { dc: polarity * vds })
    .voltageSource('bodyDrive', 'b', GROUND, { dc: polarity * vbs })
    .mosfet('underTest', { drain: 'd', gate: 'g', source: GROUND, body: 'b' }, model);
}

describe('the charge-based MOSFET channel', () => {
  it('matches the published equations evaluated offline in weak, moderate and strong inversion', () => {
    // Source: test/reference/mosfet-charge.py, C. C. Enz, F. Krummenacher and E. A. Vittoz, Analog
    // Integrated Circuits and Signal Processing 8, 1995, at 50 digits with mpmath.
    for (const c of reference.cases) {
      const what = `vgs ${c.vgs}, vds ${c.vds}, vbs ${c.vbs}`;
      const m = operatingPoint(biased(c.vgs, c.vds, c.vbs), BARE).mosfet('underTest');
      expectRelativelyClose(m.id, c.id, 1e-10, `id at ${what}`);
      expectRelativelyClose(m.gm, c.gm, 1e-9, `gm at ${what}`);
      expectRelativelyClose(m.gds, c.gds, 1e-8, `gds at ${what}`);
      expectRelativelyClose(m.gmb, c.gmb, 1e-9, `gmb at ${what}`);
      expectRelativelyClose(m.inversionCoefficient!, c.forwardCoefficient, 1e-10, `if at ${what}`);
      const expectedInversion =
        c.forwardCoefficient < 0.1 ? 'weak' : c.forwardCoefficient > 10 ? 'strong' : 'moderate';
      expect(m.inversion, what).toBe(expectedInversion);
      expect(m.region, what).toBe(
        c.reverseCoefficient <= c.forwardCoefficient / 100 ? 'saturation' : 'triode',
      );
    }
  });

  it('gives the nonlinear currents the exact second and third derivatives', () => {
    // Source: test/reference/mosfet-charge.py, mpmath.diff of the published current at 50 digits.
    for (const c of reference.cases) {
      const op = operatingPoint(biased(c.vgs, c.vds, c.vbs), BARE);
      const [channel] = op.system.deviceByName.get('underTest')!.nonlinearCurrents!(op.x, op.conditions);
      const what = `vgs ${c.vgs}, vds ${c.vds}, vbs ${c.vbs}`;
      // Controls (vgs, vds, vbs); second is 3×3, third 3×3×3, row-major.
      expectRelativelyClose(channel!.second[0]!, c.d2Dvgs2, 1e-8, `∂²id/∂vgs² at ${what}`);
      expectRelativelyClose(channel!.second[1]!, c.d2DvgsDvds, 1e-7, `∂²id/∂vgs∂vds at ${what}`);
      expectRelativelyClose(channel!.second[2]!, c.d2DvgsDvbs, 1e-8, `∂²id/∂vgs∂vbs at ${what}`);
      expectRelativelyClose(channel!.third[0]!, c.d3Dvgs3, 1e-8, `∂³id/∂vgs³ at ${what}`);
      expectRelativelyClose(channel!.third[1]!, c.d3Dvgs2Dvds, 1e-7, `∂³id/∂vgs²∂vds at ${what}`);
    }
  });

  it('tends to g_m/I_D = 1/(n·Vt) in weak inversion', () => {
    // Enz, Krummenacher and Vittoz 1995: the exponential weak-inversion limit.
    const limit = 1 / (reference.slopeFactor * reference.thermalVoltage);
    const errors = [0.2, 0.05, -0.1, -0.25].map((vgs) => {
      const m = operatingPoint(biased(vgs, 1, 0), BARE).mosfet('underTest');
      expect(m.inversion).toBe('weak');
      return Math.abs(m.gmOverId! / limit - 1);
    });
    // The gap closes as the channel goes deeper into weak inversion: below 1e-4 at vgs = −0.25 V.
    for (let k = 1; k < errors.length; k++) expect(errors[k]).toBeLessThan(errors[k - 1]!);
    expect(errors[errors.length - 1]).toBeLessThan(1e-4);
  });

  it('tends to the square law β/(2n)·(vgs − Vth0)² in strong inversion and saturation', () => {
    // Enz, Krummenacher and Vittoz 1995: the strong-inversion limit (λ = 0 here).
    const model = { ...MODEL, channelLengthModulation: 0 };
    for (const overdrive of [1.5, 2.5]) {
      const m = operatingPoint(biased(0.45 + overdrive, 5, 0, model), BARE).mosfet('underTest');
      const square = (reference.gainFactor / (2 * reference.slopeFactor)) * overdrive ** 2;
      expectRelativelyClose(m.id, square, 0.05 / overdrive, `id at V_ov = ${overdrive}`);
    }
  });

  it('mirrors a pmos: the same currents in vsg, vsd, vsb, flowing out of the drain', () => {
    const c = reference.cases[4]!;
    const pmos = { ...MODEL, polarity: 'pmos' as const, thresholdVoltage: -reference.thresholdVoltage };
    const m = operatingPoint(biased(c.vgs, c.vds, c.vbs, pmos, -1), BARE).mosfet('underTest');
    expectRelativelyClose(m.id, c.id, 1e-10, 'pmos id');
    expectRelativelyClose(m.gm, c.gm, 1e-9, 'pmos gm');
    expect(m.vgs).toBe(-c.vgs);
  });

  it('gives the linearity report the channel current’s own Taylor figures, scale id/gm', () => {
    // docs/linearity.md: for the charge-based channel x = v̂gs/(id/gm) and the second harmonic is
    // (g2·scale/g1)·x/4 from the Taylor coefficients of the current (the power identity of cos²).
    const c = reference.cases[3]!;
    const circuit = biased(c.vgs, c.vds, c.vbs)
      .voltageSource('tone', 'in', GROUND, { ac: 1e-3 })
      .capacitor('couple', 'in', 'g', '1');
    const op = operatingPoint(circuit, BARE);
    const entry = linearity(acAnalysis(op, { frequencies: [1e3] })).junctions.find(
      (j) => j.device === 'underTest',
    )!;
    const scale = c.id / c.gm;
    expectRelativelyClose(entry.scale, scale, 1e-9, 'scale id/gm');
    const x = entry.amplitude / scale;
    expectRelativelyClose(
      entry.secondHarmonic,
      ((c.d2Dvgs2 * scale) / c.gm) * (x / 4),
      1e-6,
      'second harmonic',
    );
  });
});

describe('MOSFET temperature laws and channel conductance', () => {
  it('shift the threshold by dVth/dT·(T − Tref) and scale β by (T/Tref)^(−exponent)', () => {
    // docs/devices.md, "MOSFET": Vth0(T) = Vth0 + coefficient·(T − Tref), β(T) = β·(T/Tref)^(−exponent);
    // square law in saturation (Shichman and Hodges 1968).
    const model = {
      polarity: 'nmos' as const,
      thresholdVoltage: 0.6,
      thresholdTemperatureCoefficient: -2e-3,
      mobilityTemperatureExponent: 1.5,
      referenceTemperature: 300,
    };
    const m = operatingPoint(biased(1.5, 3, 0, model), {
      temperature: 350,
      junctionConductance: 1e-30,
    }).mosfet('underTest');
    const vth = 0.6 - 2e-3 * 50;
    const beta = 1e-3 * (350 / 300) ** -1.5;
    expectRelativelyClose(m.thresholdVoltage, vth, 1e-12, 'Vth at 350 K');
    expectRelativelyClose(m.id, 0.5 * beta * (1.5 - vth) ** 2, 1e-12, 'id at 350 K');
  });

  it('leave the square law unchanged at any temperature with the defaults', () => {
    const at = (temperature: number) =>
      operatingPoint(biased(1.5, 3, 0, { polarity: 'nmos' }), { temperature }).mosfet('underTest').gm;
    expect(at(250)).toBe(at(400));
  });

  it('carry the small channel conductance of a cut-off channel in id', () => {
    // docs/devices.md: a cut-off channel conducts junctionConductance·vds (about 1 pA per volt).
    const m = operatingPoint(biased(0, 5, 0, { polarity: 'nmos' }), { junctionConductance: 1e-12 }).mosfet(
      'underTest',
    );
    expect(m.region).toBe('cutoff');
    expectRelativelyClose(m.id, 5e-12, 1e-12, 'cut-off drain current');
  });
});

describe('the charge-based channel at any bias (properties)', () => {
  it('conducts forward with non-negative gm and gds, and reverses its current when drain and source exchange', () => {
    // The model is symmetric in drain and source (Enz, Krummenacher and Vittoz 1995): id(vgs, vds, vbs)
    // = −id(vgs − vds, −vds, vbs − vds).
    fc.assert(
      fc.property(
        fc.double({ min: -0.5, max: 2.5, noNaN: true }).map(noSubnormal),
        fc.double({ min: 0, max: 3, noNaN: true }).map(noSubnormal),
        fc.double({ min: -1, max: 0, noNaN: true }).map(noSubnormal),
        (vgs, vds, vbs) => {
          const forward = operatingPoint(biased(vgs, vds, vbs), BARE).mosfet('underTest');
          const swapped = operatingPoint(biased(vgs - vds, -vds, vbs - vds), BARE).mosfet('underTest');
          const scale = Math.abs(forward.id) + 1e-30;
          return (
            forward.id >= 0 &&
            forward.gm >= 0 &&
            forward.gds >= 0 &&
            Math.abs(forward.id + swapped.id) <= 1e-12 * scale
          );
        },
      ),
      { seed: 1995, numRuns: 120 },
    );
  });
});
