/**
 * The browser example: builds a circuit, solves its operating point and small-signal response, and
 * shows the tables and a Bode plot. test/browser/page.test.ts opens the built page in a headless
 * Chromium and checks the numbers against the closed form of the divider and its RC filter.
 */
// An application imports from 'quiescent'; the example takes the sources, so that it runs without a build.
import {
  acAnalysis,
  acAnalysisHtml,
  bodePlot,
  Circuit,
  GROUND,
  logSweep,
  operatingPoint,
  operatingPointHtml,
} from '../../src/index.js';

/** The element of the page with this id. */
function section(id: string): HTMLElement {
  const element = document.getElementById(id);
  if (element === null) throw new Error(`the page has no #${id}`);
  return element;
}

const status = section('status');
try {
  // A 5 V rail with 1 V of ripple (a peak phasor of 1 V: the response reads as a ratio).
  const circuit = new Circuit()
    .voltageSource('supply', 'rail', GROUND, { dc: '5 V', ac: 1 })
    .resistor('Rtop', 'rail', 'sense', '10k')
    .resistor('Rbottom', 'sense', GROUND, '10k')
    .capacitor('Cfilter', 'sense', GROUND, '100n');
  const op = operatingPoint(circuit);
  section('operating-point').innerHTML = String(operatingPointHtml(op));

  // The filter's corner lies at 1/(2π·(Rtop ‖ Rbottom)·Cfilter) = 318.3 Hz: tabulate a decade either side.
  const corner = 1 / (2 * Math.PI * 5e3 * 100e-9);
  const table = acAnalysis(op, { frequencies: [corner / 10, corner, corner * 10] });
  section('response').innerHTML = String(acAnalysisHtml(table, { outputs: ['sense'], input: 'rail' }));

  const sweep = acAnalysis(op, { frequencies: logSweep(1, 1e5, 20) });
  section('plot').innerHTML = String(bodePlot(sweep, 'sense', 'rail', 'Ripple reaching the sensor input'));
  status.textContent = 'ready';
} catch (error) {
  status.textContent = `error: ${error instanceof Error ? error.message : String(error)}`;
  throw error;
}
