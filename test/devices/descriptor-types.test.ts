/**
 * The registry of element kinds is typed so that a kind left out, or a descriptor with a part left
 * out, does not compile (DEVELOPERS.md, "Adding a device kind"). `npm test` runs `tsc --noEmit`
 * first, so each `@ts-expect-error` below fails the run if the error it expects goes away.
 */
import { describe, expect, it } from 'vitest';
import { Circuit } from '../../src/circuit/circuit.js';
import type { ElementBuilder, KindDescriptor, KindRegistry } from '../../src/devices/descriptor.js';
import { ELEMENT_KINDS, KINDS } from '../../src/devices/registry.js';
import { RESISTOR } from '../../src/devices/resistor/descriptor.js';

describe('the registry of element kinds', () => {
  it('does not type-check with a part of a descriptor or a kind left out', () => {
    // A descriptor without its DC paths is not a descriptor.
    const { dcPaths: _dropped, ...withoutDcPaths } = RESISTOR;
    // @ts-expect-error dcPaths is missing
    const incomplete: KindDescriptor<'resistor'> = withoutDcPaths;
    // A registry that forgets a kind is not a registry.
    const { mosfet: _forgotten, ...withoutMosfet } = KINDS;
    // @ts-expect-error the mosfet kind is missing
    const forgetful: KindRegistry = withoutMosfet;
    // A descriptor filed under another kind's name is not accepted either.
    // @ts-expect-error a resistor's descriptor is not a capacitor's
    const misfiled: KindRegistry = { ...KINDS, capacitor: RESISTOR };
    // A descriptor that leaves a number field of its record without a unit and range is not either.
    // @ts-expect-error values.resistance is missing
    const unitless: KindDescriptor<'resistor'> = { ...RESISTOR, values: {} };
    expect('dcPaths' in incomplete).toBe(false);
    expect(unitless.values).toEqual({});
    expect('mosfet' in forgetful).toBe(false);
    expect(misfiled.capacitor.kind).toBe('resistor');
  });

  it('replays documents through the builder the circuit really has', () => {
    // Compile-checked: the builder signatures that JSON replay calls are the circuit's own.
    const builder: ElementBuilder = new Circuit();
    expect(typeof builder.resistor).toBe('function');
  });

  it('holds one descriptor per kind, each under its own name', () => {
    for (const kind of ELEMENT_KINDS) expect(KINDS[kind].kind).toBe(kind);
    expect(ELEMENT_KINDS).toHaveLength(14);
  });

  it('names every terminal field of a kind in its JSON fields', () => {
    for (const kind of ELEMENT_KINDS) {
      const fields = Object.keys(KINDS[kind].json).map((f) => f.replace(/\?$/, ''));
      for (const t of KINDS[kind].terminals) expect(fields).toContain(t.field);
    }
  });

  it('gives a controlling-element field only to kinds that read another element’s current', () => {
    const controlled = ELEMENT_KINDS.filter((k) => KINDS[k].controlField !== null);
    expect(controlled).toEqual(['ccvs', 'cccs']);
  });
});
