/**
 * Checks of what a public function was given, at the boundary: a circuit where a circuit goes, an
 * analysis result where one goes, an options object or nothing where options go. JavaScript callers
 * and parsed documents bypass the types, so every entry point checks before it reads a field.
 */
import { Circuit } from '../circuit/circuit.js';
import { wrongArgument } from '../errors/messages.js';

/**
 * Require a {@link Circuit}. A plain object (a parsed document, say) is rejected rather than read:
 * it would skip every check the builder and `Circuit.fromJSON` make.
 */
export function requireCircuit(value: unknown, argument = 'circuit'): asserts value is Circuit {
  if (!(value instanceof Circuit)) {
    throw wrongArgument(
      argument,
      value,
      'a Circuit (built with new Circuit(), or read with Circuit.fromJSON(document))',
      'invalid-circuit',
    );
  }
}

/** Require an instance of `type` (an analysis result), described as `what` in the message. */
export function requireInstance<T>(
  value: unknown,
  type: abstract new (...args: never[]) => T,
  argument: string,
  what: string,
): asserts value is T {
  if (!(value instanceof type)) throw wrongArgument(argument, value, what);
}

export { requireOptions } from '../errors/arguments.js';
