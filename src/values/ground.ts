/** The name of the reference node. */

/** The reference node. Every circuit must connect something to it. */
export const GROUND = 'gnd';
