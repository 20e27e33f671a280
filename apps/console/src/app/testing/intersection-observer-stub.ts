/**
 * jsdom has no IntersectionObserver, which `@defer (on viewport)` needs even when the test keeps
 * the deferred blocks on their placeholders. This stand-in records what it is asked to watch.
 */
class IntersectionObserverStub {
  readonly observed: Element[] = [];
  observe(target: Element): void {
    this.observed.push(target);
  }
  unobserve(): void {
    this.observed.length = 0;
  }
  disconnect(): void {
    this.observed.length = 0;
  }
}

export function stubIntersectionObserver(): void {
  if (!('IntersectionObserver' in globalThis)) Object.assign(globalThis, { IntersectionObserver: IntersectionObserverStub });
}
