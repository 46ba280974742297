/**
 * A value argument: a finite number in SI base units, or a string of a decimal number, an optional SI
 * prefix and an optional unit symbol (`'4.7k'`, `'10uF'`, `'2.2 nF'`, `'330 Ω'`).
 */
export type Value = number | string;
