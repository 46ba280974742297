/**
 * Where the Monte Carlo worker module lives: beside this module in the built package
 * (`monte-carlo-worker.js`), or, when the library runs from its TypeScript sources, a small module
 * that loads the TypeScript worker through the development loader.
 */
import type { ScriptLocation } from './signals.js';

/** The URL of the worker module for worker threads (Node) and module web workers (browsers). */
export function defaultWorkerScript(): URL {
  const here = import.meta.url;
  return here.endsWith('.ts')
    ? new URL('./monte-carlo-worker-source.mjs', here)
    : new URL('./monte-carlo-worker.js', here);
}

/**
 * The script argument for the pool: a file path for a `file:` URL (Node's worker threads take a path
 * string, not a URL string), the URL's text otherwise (browsers).
 */
export function scriptArgument(script: string | ScriptLocation): string {
  if (typeof script === 'string') return script;
  if (script.protocol !== 'file:') return script.href;
  const path = decodeURIComponent(script.pathname);
  // A drive letter on Windows: /C:/dir → C:/dir.
  return /^\/[A-Za-z]:\//.test(path) ? path.slice(1) : path;
}
