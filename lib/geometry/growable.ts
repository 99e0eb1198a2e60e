/** Typed arrays that grow by 1.5× (not 2×) so the transient copy stays modest. */
export class GrowableFloat32 {
  data: Float32Array;
  length = 0;
  constructor(initialCapacity = 1 << 16) {
    this.data = new Float32Array(Math.max(16, initialCapacity));
  }
  reserve(extra: number): void {
    const need = this.length + extra;
    if (need <= this.data.length) return;
    let cap = this.data.length;
    while (cap < need) cap = Math.ceil(cap * 1.5);
    const next = new Float32Array(cap);
    next.set(this.data.subarray(0, this.length));
    this.data = next;
  }
  /** The filled part; copies only when the slack is large, to give memory back. */
  finish(): Float32Array {
    if (this.data.length > this.length * 1.15 + 1024) return this.data.slice(0, this.length);
    return this.data.subarray(0, this.length);
  }
}

export class GrowableUint32 {
  data: Uint32Array;
  length = 0;
  constructor(initialCapacity = 1 << 16) {
    this.data = new Uint32Array(Math.max(16, initialCapacity));
  }
  reserve(extra: number): void {
    const need = this.length + extra;
    if (need <= this.data.length) return;
    let cap = this.data.length;
    while (cap < need) cap = Math.ceil(cap * 1.5);
    const next = new Uint32Array(cap);
    next.set(this.data.subarray(0, this.length));
    this.data = next;
  }
  finish(): Uint32Array {
    if (this.data.length > this.length * 1.15 + 1024) return this.data.slice(0, this.length);
    return this.data.subarray(0, this.length);
  }
}
