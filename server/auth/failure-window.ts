/**
 * Failures per key within a sliding window, kept in this process (behind a load balancer each
 * process counts on its own). Memory stays bounded: old entries are dropped as the map grows.
 */
export class FailureWindow {
  private readonly failures = new Map<string, number[]>()

  constructor(
    private readonly windowMs: number,
    private readonly now: () => number = Date.now,
  ) {}

  count(key: string): number {
    const recent = this.recent(key)
    if (recent.length === 0) this.failures.delete(key)
    else this.failures.set(key, recent)
    return recent.length
  }

  add(key: string): void {
    this.failures.set(key, [...this.recent(key), this.now()])
    if (this.failures.size > 50_000) this.prune()
  }

  clear(key: string): void {
    this.failures.delete(key)
  }

  private recent(key: string): number[] {
    const since = this.now() - this.windowMs
    return (this.failures.get(key) ?? []).filter((at) => at > since)
  }

  private prune(): void {
    for (const key of [...this.failures.keys()]) this.count(key)
  }
}
