/**
 * The shapes of the platform objects the Monte Carlo run takes, stated here so that the package's
 * declarations need neither the DOM nor Node's type library: an `AbortSignal` and a `URL` satisfy them.
 */

/** What `monteCarlo` reads of an AbortSignal: whether it fired, and its abort event. */
export interface CancelSignal {
  /** Whether the signal has fired. */
  readonly aborted: boolean;
  /** Listen for the abort event. */
  addEventListener(type: 'abort', listener: () => void, options?: { once?: boolean }): void;
  /** Stop listening. */
  removeEventListener(type: 'abort', listener: () => void): void;
}

/** What the worker pool reads of a URL: its text, protocol and path. */
export interface ScriptLocation {
  /** The whole URL. */
  readonly href: string;
  /** `'file:'`, `'https:'`, … */
  readonly protocol: string;
  /** The path part, percent-encoded. */
  readonly pathname: string;
}
