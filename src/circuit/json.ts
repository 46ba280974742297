/**
 * The JSON form of a circuit: a versioned document of element records. Reading validates every
 * field and replays the builder, so a document is held to exactly the checks a program is.
 */

import { ELEMENT_KINDS, isElementKind, KINDS } from '../devices/registry.js';
import { invalidCircuit } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import { describeGiven, formatPath } from '../errors/wording.js';
import type { Circuit } from './circuit.js';
import type { ElementKind, ElementRecord } from './elements.js';

/** The name that marks a circuit document. */
export const DOCUMENT_FORMAT = 'quiescent-circuit';
/** The version of the document shape written by this release. */
export const DOCUMENT_VERSION = 1;

/** A circuit as plain JSON: `{ format, version, elements }`, each element its record with numbers in SI units. */
export interface CircuitDocument {
  /** Always {@link DOCUMENT_FORMAT}, `'quiescent-circuit'`. */
  readonly format: typeof DOCUMENT_FORMAT;
  /** The document version, {@link DOCUMENT_VERSION} for documents this release writes. */
  readonly version: number;
  /** The element records in the order they were added, with `kind`, `name`, nodes and SI values. */
  readonly elements: readonly Record<string, unknown>[];
}

/** Serialize element records; parameters that are Infinity (their default) are left out, as JSON has no Infinity. */
export function circuitToJson(elements: readonly ElementRecord[]): CircuitDocument {
  const out = elements.map((e) => {
    const copy: Record<string, unknown> = { ...e };
    // A fresh AC object, so that editing the document never reaches the circuit.
    if ('ac' in e) copy.ac = { ...e.ac };
    for (const key of ['model', 'options'] as const) {
      const params = (e as Partial<Record<typeof key, Record<string, number> | undefined>>)[key];
      if (params === undefined) {
        delete copy[key];
        continue;
      }
      const kept: Record<string, number> = {};
      for (const [k, v] of Object.entries(params)) if (Number.isFinite(v)) kept[k] = v;
      copy[key] = kept;
    }
    return copy;
  });
  return { format: DOCUMENT_FORMAT, version: DOCUMENT_VERSION, elements: out };
}

function isPlainObject(x: unknown): x is Record<string, unknown> {
  return x !== null && typeof x === 'object' && !Array.isArray(x);
}

function checkFields(raw: Record<string, unknown>, kind: ElementKind, path: (string | number)[]): void {
  const fields = KINDS[kind].json;
  const allowed = new Set(['kind', 'name']);
  for (const [spec, type] of Object.entries(fields)) {
    const optional = spec.endsWith('?');
    const key = optional ? spec.slice(0, -1) : spec;
    allowed.add(key);
    const present = Object.hasOwn(raw, key);
    if (!present) {
      if (optional) continue;
      throw invalidCircuit([...path, key], { kind: 'missing', of: kind });
    }
    const v = raw[key];
    const ok =
      type === 'string'
        ? typeof v === 'string'
        : type === 'number'
          ? typeof v === 'number'
          : type === 'boolean'
            ? typeof v === 'boolean'
            : type === 'polarity'
              ? typeof v === 'string'
              : type === 'ac'
                ? typeof v === 'number' || isPlainObject(v)
                : isPlainObject(v);
    if (!ok)
      throw invalidCircuit([...path, key], {
        kind: 'wrong-type',
        expected: type === 'polarity' ? 'string' : type,
      });
  }
  for (const key of Object.keys(raw)) {
    if (!allowed.has(key))
      throw invalidCircuit([...path, key], {
        kind: 'unknown-key',
        what: 'field',
        of: kind,
        known: [...allowed],
      });
  }
}

/**
 * Move an error raised by the builder to the element's place in the document. The builder's paths
 * start with the element name (except when the name itself is bad); the kind's descriptor maps its
 * argument paths to document fields (`out[0]` of a controlled source is `outPlus`), and the
 * polarity, inside the model for the builder, is a field of the element in the document. The
 * message is worded again from the moved details, so the path appears once.
 */
function relocate(error: unknown, path: (string | number)[], name: string, kind: ElementKind): never {
  if (!(error instanceof QuiescentError)) throw error;
  const d = error.details;
  if (d.code !== 'invalid-value' && d.code !== 'invalid-circuit' && d.code !== 'unknown-element') throw error;
  const builderPath = d.path ?? [];
  let inner: readonly (string | number)[] = builderPath[0] === name ? builderPath.slice(1) : builderPath;
  if (inner.length === 2 && inner[0] === 'model' && inner[1] === 'polarity') inner = ['polarity'];
  const mapped = KINDS[kind].documentPaths[formatPath(inner)];
  if (mapped !== undefined) inner = mapped;
  const where = [...path, ...inner];
  if (d.code === 'unknown-element') throw new QuiescentError({ ...d, path: where });
  throw new QuiescentError({ ...d, path: where, element: name });
}

/** Validate a document field by field and replay it into `circuit`. */
export function circuitFromJson(json: unknown, circuit: Circuit): void {
  if (!isPlainObject(json)) throw invalidCircuit([], { kind: 'not-an-object', what: 'document' });
  for (const key of Object.keys(json)) {
    if (key !== 'format' && key !== 'version' && key !== 'elements') {
      throw invalidCircuit([key], {
        kind: 'unknown-key',
        what: 'document field',
        known: ['format', 'version', 'elements'],
      });
    }
  }
  if (json.format !== DOCUMENT_FORMAT) {
    throw invalidCircuit(['format'], {
      kind: 'not-one-of',
      what: 'format',
      allowed: [DOCUMENT_FORMAT],
      got: describeGiven(json.format),
    });
  }
  if (json.version !== DOCUMENT_VERSION) {
    throw invalidCircuit(['version'], {
      kind: 'unsupported-version',
      got: String(json.version),
      supported: DOCUMENT_VERSION,
    });
  }
  if (!Array.isArray(json.elements))
    throw invalidCircuit(['elements'], { kind: 'not-an-object', what: 'elements' });
  json.elements.forEach((raw: unknown, i: number) => {
    const path: (string | number)[] = ['elements', i];
    if (!isPlainObject(raw)) throw invalidCircuit(path, { kind: 'not-an-object', what: 'element' });
    const kind = raw.kind;
    if (typeof kind !== 'string' || !isElementKind(kind)) {
      throw invalidCircuit([...path, 'kind'], {
        kind: 'not-one-of',
        what: 'kind',
        allowed: ELEMENT_KINDS,
        got: String(JSON.stringify(kind)),
      });
    }
    if (typeof raw.name !== 'string')
      throw invalidCircuit([...path, 'name'], { kind: 'wrong-type', expected: 'string' });
    checkFields(raw, kind as ElementKind, path);
    if (isPlainObject(raw.model) && Object.hasOwn(raw.model, 'polarity')) {
      // The element's own polarity field would silently win over this one.
      throw invalidCircuit([...path, 'model', 'polarity'], { kind: 'polarity-in-model' }, raw.name);
    }
    try {
      replay(circuit, kind as ElementKind, raw);
    } catch (error) {
      relocate(error, path, raw.name, kind as ElementKind);
    }
  });
}

function replay(c: Circuit, kind: ElementKind, r: Record<string, unknown>): void {
  KINDS[kind].replay(c, r.name as string, r);
}
