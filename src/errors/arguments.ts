/**
 * Checks of what a public function was given, shared by every folder: an options object or nothing
 * where options go, a result of the right kind where one goes. JavaScript callers and parsed
 * documents bypass the types, so every entry point checks before it reads a field.
 */
import { wrongArgument } from './messages.js';

/** Require an options object (a plain object or class instance, not an array), or nothing when optional. */
export function requireOptions(value: unknown, argument = 'options', optional = true): void {
  if (value === undefined && optional) return;
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    throw wrongArgument(argument, value, optional ? 'an options object or nothing' : 'an options object');
  }
}

/**
 * Require an object that has every member named in `members` (a result of the library, checked by
 * shape where importing its class would tie folders together), described as `what`.
 */
export function requireShape(
  value: unknown,
  argument: string,
  what: string,
  members: readonly string[],
): void {
  if (value === null || typeof value !== 'object' || members.some((m) => !(m in value))) {
    throw wrongArgument(argument, value, what);
  }
}
