export { DEFAULT_DIGITS, type FormatOptions, formatValue } from './format.js';
export { parseValue } from './parse.js';
export { quantityName, type Unit } from './units.js';
export type { Value } from './value.js';
