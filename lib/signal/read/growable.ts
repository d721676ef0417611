// Append-only typed arrays kept as a list of blocks: the first blocks double (1 Ki .. 64 Ki values), then every block
// holds 64 Ki values. Nothing is ever copied while growing, and taking the result copies each value once into a
// right-sized array; so a long recording peaks at about twice its final size instead of up to three times. When the
// number of values is known in advance, the first block has exactly that size and is itself the result.
type TypedCtor<T> = { new (length: number): T };

const FIRST = 1024;
const LARGEST = 65_536;

export class Growable<T extends Float64Array | Uint32Array | Uint8Array> {
  private full: T[] = [];
  private block: T;
  private used = 0;
  /** values in the full blocks */
  private before = 0;

  /**
   * `capacity`: the number of values expected, when known; the first block then holds them all (no copy on take).
   * `first`: that block, when the caller provides it (an array of zeros of `capacity` values).
   */
  constructor(
    private readonly ctor: TypedCtor<T>,
    capacity?: number,
    first?: T,
    /** take() returns a view of the first block when it is the only one (a capacity that was an upper bound) */
    private readonly viewOnTake = false,
  ) {
    this.block = first ?? new ctor(capacity !== undefined && capacity > 0 ? capacity : FIRST);
  }

  get length(): number {
    return this.before + this.used;
  }

  /** The block being filled and how many of its values are used: a caller may write after them, then `grow`. */
  get current(): T {
    return this.block;
  }

  get filled(): number {
    return this.used;
  }

  /** Counts `count` values written by the caller into `current` after `filled` (within its length). */
  grow(count: number): void {
    if (this.used + count > this.block.length) throw new RangeError('grow() past the block');
    this.used += count;
  }

  push(value: number): void {
    if (this.used === this.block.length) this.next();
    this.block[this.used++] = value;
  }

  private next(): void {
    this.full.push(this.block);
    this.before += this.used;
    this.block = new this.ctor(Math.min(Math.max(this.block.length * 2, FIRST), LARGEST));
    this.used = 0;
  }

  /**
   * A right-sized array of the values pushed so far. The blocks are released (the Growable is empty afterwards),
   * so a reader that stays referenced does not keep a second copy of the recording alive.
   */
  take(): T {
    if (this.full.length === 0 && this.used === this.block.length) {
      // exactly one full block (a capacity that was right): it is the result
      const whole = this.block;
      this.block = new this.ctor(0);
      this.used = 0;
      return whole;
    }
    if (this.full.length === 0 && this.viewOnTake) {
      const view = this.block.subarray(0, this.used) as T;
      this.block = new this.ctor(0);
      this.used = 0;
      return view;
    }
    const out = new this.ctor(this.length);
    let at = 0;
    for (const b of this.full) {
      out.set(b, at);
      at += b.length;
    }
    out.set(this.block.subarray(0, this.used), at);
    this.full = [];
    this.block = new this.ctor(0);
    this.before = 0;
    this.used = 0;
    return out;
  }
}
