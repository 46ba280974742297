/**
 * Output that a notebook shows richly. JavaScript notebook kernels look for a method under
 * `Symbol.for('Jupyter.display')` on the value a cell ends with and show the MIME bundle it returns
 * (the Deno kernel documents this hook as `Deno.jupyter.$display`); a kernel that knows no hook shows
 * the text, and every kernel can be handed the HTML or SVG text itself (`toString()`).
 */

/** The symbol notebook kernels call for a rich display of a value. */
export const NOTEBOOK_DISPLAY: unique symbol = Symbol.for('Jupyter.display');

/** A Jupyter MIME bundle: the same content in several media types, the richest shown. */
export interface MimeBundle {
  /** HTML text. */
  readonly 'text/html'?: string;
  /** An SVG document. */
  readonly 'image/svg+xml'?: string;
  /** Plain text, shown where nothing richer is. */
  readonly 'text/plain': string;
}

/** HTML or SVG that shows itself in a notebook, and is its own text everywhere else. */
export class RichOutput {
  /** The media type of {@link RichOutput.text}. */
  readonly type: 'text/html' | 'image/svg+xml';
  /** The HTML or SVG text. */
  readonly text: string;
  /** The plain-text stand-in. */
  readonly plain: string;

  /**
   * @param type - `'text/html'` or `'image/svg+xml'`
   * @param text - the HTML or SVG text
   * @param plain - the plain-text stand-in
   */
  constructor(type: 'text/html' | 'image/svg+xml', text: string, plain: string) {
    this.type = type;
    this.text = text;
    this.plain = plain;
  }

  /** The MIME bundle a notebook kernel shows. */
  [NOTEBOOK_DISPLAY](): MimeBundle {
    return this.type === 'text/html'
      ? { 'text/html': this.text, 'text/plain': this.plain }
      : { 'image/svg+xml': this.text, 'text/plain': this.plain };
  }

  /** The HTML or SVG text, for a page (`element.innerHTML = String(output)`) or a file. */
  toString(): string {
    return this.text;
  }
}
