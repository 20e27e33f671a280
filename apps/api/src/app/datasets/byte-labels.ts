/**
 * Gives each different byte sequence (a cell's raw bytes) a small id, without making a string per
 * cell: an open-addressing hash table over FNV-1a hashes, the bytes kept once in an arena. Strings
 * are made only once per different value, by the caller, from `bytesOf(id)`.
 */
export class ByteLabels {
  private slots = new Int32Array(64).fill(-1);
  private hashes: number[] = [];
  private offsets: number[] = [];
  private lengths: number[] = [];
  private arena = new Uint8Array(1024);
  private used = 0;

  get size(): number {
    return this.offsets.length;
  }

  /** The id of bytes[start, end), or -1 when it is new (then `add` it). */
  find(bytes: Uint8Array, start: number, end: number): number {
    const hash = fnv1a(bytes, start, end);
    const mask = this.slots.length - 1;
    for (let slot = hash & mask; ; slot = (slot + 1) & mask) {
      const id = this.slots[slot];
      if (id === -1) return -1;
      if (this.hashes[id] === hash && this.sameBytes(id, bytes, start, end)) return id;
    }
  }

  /** Adds bytes[start, end), known to be new, and answers its id. */
  add(bytes: Uint8Array, start: number, end: number): number {
    const length = end - start;
    if (this.used + length > this.arena.length) {
      const larger = new Uint8Array(Math.max(this.arena.length * 2, this.used + length));
      larger.set(this.arena.subarray(0, this.used));
      this.arena = larger;
    }
    this.arena.set(bytes.subarray(start, end), this.used);
    const id = this.offsets.length;
    const hash = fnv1a(bytes, start, end);
    this.hashes.push(hash);
    this.offsets.push(this.used);
    this.lengths.push(length);
    this.used += length;
    if (this.offsets.length * 2 > this.slots.length) this.grow();
    else this.place(id, hash);
    return id;
  }

  bytesOf(id: number): Uint8Array {
    return this.arena.subarray(this.offsets[id], this.offsets[id] + this.lengths[id]);
  }

  private sameBytes(id: number, bytes: Uint8Array, start: number, end: number): boolean {
    const length = this.lengths[id];
    if (length !== end - start) return false;
    const arena = this.arena;
    for (let i = 0, at = this.offsets[id]; i < length; i++, at++) if (arena[at] !== bytes[start + i]) return false;
    return true;
  }

  private place(id: number, hash: number): void {
    const mask = this.slots.length - 1;
    let slot = hash & mask;
    while (this.slots[slot] !== -1) slot = (slot + 1) & mask;
    this.slots[slot] = id;
  }

  private grow(): void {
    this.slots = new Int32Array(this.slots.length * 2).fill(-1);
    for (let id = 0; id < this.hashes.length; id++) this.place(id, this.hashes[id]);
  }
}

/** FNV-1a, 32 bits (Fowler, Noll and Vo; http://www.isthe.com/chongo/tech/comp/fnv/). */
function fnv1a(bytes: Uint8Array, start: number, end: number): number {
  let hash = 0x811c9dc5;
  for (let i = start; i < end; i++) hash = Math.imul(hash ^ bytes[i], 0x01000193);
  return hash >>> 0;
}
