const BLOCK = 65_536

/**
 * Values of one column while a record is read. When the number of points can be estimated,
 * one array of that size takes them all and is handed out without a copy (pages never written
 * cost no memory); beyond it, or without an estimate, values go into blocks that are copied
 * once into one exact typed array at the end.
 */
export class ColumnStore {
  private readonly blocks: Float64Array[] = []
  private current = new Float64Array(0)
  private used = 0

  constructor(expected = 0) {
    if (expected > 0) this.blocks.push((this.current = new Float64Array(expected)))
  }

  push(value: number): void {
    if (this.used === this.current.length) {
      this.current = new Float64Array(BLOCK)
      this.blocks.push(this.current)
      this.used = 0
    }
    this.current[this.used++] = value
  }

  /** All values in one array; the blocks are released. */
  toArray(count: number): Float64Array {
    const blocks = this.blocks.splice(0)
    this.current = new Float64Array(0)
    if (blocks.length === 1) return blocks[0]!.subarray(0, count)
    const values = new Float64Array(count)
    let offset = 0
    for (const block of blocks) {
      const length = Math.min(block.length, count - offset)
      values.set(length === block.length ? block : block.subarray(0, length), offset)
      offset += length
    }
    return values
  }
}
