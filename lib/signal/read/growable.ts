// Append-only typed arrays that double their capacity, so a long recording costs a small multiple of its final size.
type TypedCtor<T> = { new (length: number): T };

export class Growable<T extends Float64Array | Uint32Array | Uint8Array> {
  private data: T;
  length = 0;

  constructor(private readonly ctor: TypedCtor<T>, capacity = 1024) {
    this.data = new ctor(capacity);
  }

  push(value: number): void {
    if (this.length === this.data.length) {
      const next = new this.ctor(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = value;
  }

  /** A right-sized copy of the values pushed so far. */
  toArray(): T {
    return this.data.slice(0, this.length) as T;
  }
}
