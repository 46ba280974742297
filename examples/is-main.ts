/** Whether a module is the script Node was started with (so examples print when run, not when imported). */
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * @param moduleUrl - the module's `import.meta.url`
 * @returns true when the module is the entry script
 */
export function isMain(moduleUrl: string): boolean {
  const entry = process.argv[1];
  return entry !== undefined && resolve(entry) === fileURLToPath(moduleUrl);
}
