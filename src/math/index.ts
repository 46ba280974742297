export {
  type BesselOrder,
  besselI,
  besselI0MinusOne,
  besselI2OverI1,
  besselI3OverI1,
  SERIES_LIMIT,
  scaledBesselI,
} from './bessel.js';
export {
  channelAmplitudeForBound,
  channelErrorBound,
  channelMeanShift,
  channelNonlinearity,
  channelSecondHarmonic,
  channelThirdHarmonic,
  junctionAmplitudeForBound,
  junctionErrorBound,
  junctionMeanShift,
  junctionNonlinearity,
  junctionSecondHarmonic,
  junctionThirdHarmonic,
  type NonlinearityFigures,
} from './junction-nonlinearity.js';
export { lambertW0, lambertW0OfExp } from './lambert-w.js';
export {
  type TaylorCoefficients,
  taylorAmplitudeForBound,
  taylorNonlinearity,
} from './taylor-nonlinearity.js';
