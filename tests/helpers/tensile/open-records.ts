import { readdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import { REPO_ROOT } from './run-cli'

/** The open 42CrMoS4 records (CC BY 4.0, see the fixture folder's README and licence). */
export const OPEN_RECORDS_DIR = path.join(REPO_ROOT, 'tests/fixtures/tensile-42CrMoS4')

/** The originating lab's evaluated values, read from a record's preamble. */
export interface LabValues {
  rp02: number
  rp1: number
  rm: number
  ag: number
  a: number
  z: number
  slope: number
}

function preambleNumber(text: string, key: string): number {
  const line = text.split('\n').find((candidate) => candidate.startsWith(key))
  const value = Number(line?.split('\t')[1])
  if (!Number.isFinite(value)) throw new Error(`No '${key}' in the record`)
  return value
}

export function openRecordFiles(): string[] {
  return readdirSync(OPEN_RECORDS_DIR)
    .filter((name) => name.endsWith('.csv'))
    .sort()
}

export function labValues(file: string): LabValues {
  const text = readFileSync(path.join(OPEN_RECORDS_DIR, file), 'utf8')
  return {
    rp02: preambleNumber(text, 'Yield stress at 0.2% plastic strain:'),
    rp1: preambleNumber(text, 'Yield stress at 1% plastic strain:'),
    rm: preambleNumber(text, 'Ultimate tensile strength:'),
    ag: preambleNumber(text, 'Uniform elongation:'),
    a: preambleNumber(text, 'Elongation after fracture:'),
    z: preambleNumber(text, 'Reduction of area:'),
    slope: preambleNumber(text, 'Slope of linear-elastic region:'),
  }
}
