/**
 * A queue that takes turns between owners: each owner's jobs wait in their own line, and the next
 * job comes from the next owner in rotation. One person queueing twenty long runs therefore delays
 * another person by at most one run per turn, not by twenty.
 */
export class FairQueue<T> {
  private readonly lines = new Map<string, T[]>();
  /** Owners with waiting jobs, in the order their turn comes. */
  private readonly rotation: string[] = [];
  private waiting = 0;

  get size(): number {
    return this.waiting;
  }

  push(owner: string, job: T): void {
    const line = this.lines.get(owner);
    if (line) {
      line.push(job);
    } else {
      this.lines.set(owner, [job]);
      this.rotation.push(owner);
    }
    this.waiting += 1;
  }

  /** The next owner's oldest job; that owner then goes to the back of the rotation. */
  shift(): T | undefined {
    const owner = this.rotation.shift();
    if (owner === undefined) return undefined;
    const line = this.lines.get(owner)!;
    const job = line.shift()!;
    if (line.length) this.rotation.push(owner);
    else this.lines.delete(owner);
    this.waiting -= 1;
    return job;
  }

  /** Takes a job out wherever it waits (it gave up waiting); false when it was no longer queued. */
  remove(owner: string, job: T): boolean {
    const line = this.lines.get(owner);
    const index = line ? line.indexOf(job) : -1;
    if (!line || index < 0) return false;
    line.splice(index, 1);
    if (!line.length) {
      this.lines.delete(owner);
      this.rotation.splice(this.rotation.indexOf(owner), 1);
    }
    this.waiting -= 1;
    return true;
  }

  /** Empties the queue, handing back every job (to refuse them when the pool closes). */
  drain(): T[] {
    const all = [...this.lines.values()].flat();
    this.lines.clear();
    this.rotation.length = 0;
    this.waiting = 0;
    return all;
  }
}
