/**
 * Typed arrays carved from one buffer. A workspace of a dozen small arrays then costs one allocation:
 * under V8 each typed array of its own costs about 250 ns and a backing store the collector tracks
 * one by one (a solver's set-up on a 19-unknown circuit took about 45 µs, most of it in allocation
 * and collection), while a view on a shared buffer costs about 20 ns.
 *
 * Only arrays that live and die together belong in one arena: a view keeps the whole buffer alive,
 * so storage that may be replaced by a larger array (the L and U of a factorization) stays apart.
 */
export class TypedArena {
  readonly #buffer: ArrayBuffer;
  #float64: number;
  readonly #float64End: number;
  #int32: number;
  readonly #int32End: number;
  #uint8: number;
  readonly #uint8End: number;

  /** Room for `float64s` doubles, `int32s` 32-bit integers and `uint8s` bytes, each region aligned. */
  constructor(float64s: number, int32s = 0, uint8s = 0) {
    this.#float64 = 0;
    this.#float64End = 8 * float64s;
    this.#int32 = this.#float64End;
    this.#int32End = this.#int32 + 4 * int32s;
    this.#uint8 = this.#int32End;
    this.#uint8End = this.#uint8 + uint8s;
    this.#buffer = new ArrayBuffer(this.#uint8End);
  }

  /** The next `length` doubles, zeroed. */
  float64(length: number): Float64Array {
    const start = this.#float64;
    this.#float64 = start + 8 * length;
    if (this.#float64 > this.#float64End) throw new Error('TypedArena: more doubles taken than reserved');
    return new Float64Array(this.#buffer, start, length);
  }

  /** The next `length` 32-bit integers, zeroed. */
  int32(length: number): Int32Array {
    const start = this.#int32;
    this.#int32 = start + 4 * length;
    if (this.#int32 > this.#int32End) throw new Error('TypedArena: more integers taken than reserved');
    return new Int32Array(this.#buffer, start, length);
  }

  /** The next `length` bytes, zeroed. */
  uint8(length: number): Uint8Array {
    const start = this.#uint8;
    this.#uint8 = start + length;
    if (this.#uint8 > this.#uint8End) throw new Error('TypedArena: more bytes taken than reserved');
    return new Uint8Array(this.#buffer, start, length);
  }
}
