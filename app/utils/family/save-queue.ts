/**
 * The save queue of a live run: batches are saved one after the other (the server checks each
 * before storing it), and the computation may run at most `maxUnsaved` points ahead of what is
 * saved. `push` resolves when there is room again, so a worker that awaits it (the family
 * runner awaits its batch callback) pauses while the server catches up. Pure (no Vue).
 */
import type { FamilyBatch } from '#shared/families/runner'

/** Default bound on computed but unsaved points. */
export const MAX_UNSAVED_POINTS = 200

/** Counts a page shows. */
export interface SaveQueueState { computed: number, saved: number, error: string, waiting: boolean }

export class SaveQueue {
  computed = 0
  saved = 0
  error = ''
  private chain: Promise<void> = Promise.resolve()
  private waiters: (() => void)[] = []

  constructor(
    private readonly save: (b: FamilyBatch) => Promise<unknown>,
    private readonly describeError: (e: unknown) => string,
    private readonly onChange: (s: SaveQueueState) => void = () => {},
    readonly maxUnsaved = MAX_UNSAVED_POINTS,
  ) {}

  /** Points computed and not yet saved. */
  get unsaved(): number { return this.computed - this.saved }

  private changed(): void { this.onChange({ computed: this.computed, saved: this.saved, error: this.error, waiting: this.waiters.length > 0 }) }

  private release(): void {
    if (this.unsaved > this.maxUnsaved && !this.error) return
    for (const w of this.waiters.splice(0)) w()
  }

  /** Queues a batch; resolves once at most maxUnsaved points are unsaved (or saving has stopped on an error). */
  push(b: FamilyBatch): Promise<void> {
    if (!b.points.length && !b.specialPoints.length) return Promise.resolve()
    const n = b.points.length
    this.computed += n
    this.chain = this.chain.then(async () => {
      if (this.error) return
      try { await this.save(b); this.saved += n } catch (e) { this.error = this.describeError(e) }
      this.release()
      this.changed()
    })
    const room = this.unsaved <= this.maxUnsaved || this.error ? Promise.resolve() : new Promise<void>(resolve => this.waiters.push(resolve))
    this.changed()
    return room
  }

  /** Resolves when every queued batch is saved (or saving stopped on an error). */
  flush(): Promise<void> { return this.chain }
}
