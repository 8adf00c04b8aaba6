import type { SpecificationRecord } from './specification'

/*
 * Starter set of specification records. Every number below was recalled from memory, not read
 * from the standard: an administrator must check each against the edition the client names
 * before a report relies on it. The source field says so on every record.
 */
const RECALLED = 'recalled from memory, not read from the standard'

export const STARTER_SPECIFICATIONS: readonly SpecificationRecord[] = [
  {
    designation: 'A36',
    standard: 'ASTM A36/A36M',
    edition: null,
    grade: 'A36',
    productForm: 'plate',
    thicknessBandMm: { over: null, upTo: 200 },
    yield: { minMPa: 250, kind: 'ReH' },
    tensileStrength: { minMPa: 400, maxMPa: 550 },
    elongation: [
      { minPct: 20, basis: { kind: 'fixed', lengthMm: 200 } },
      { minPct: 23, basis: { kind: 'fixed', lengthMm: 50 } },
    ],
    reductionOfAreaMinPct: null,
    hardness: null,
    source: RECALLED,
  },
  {
    designation: 'A572-50',
    standard: 'ASTM A572/A572M',
    edition: null,
    grade: 'Grade 50 [345]',
    productForm: 'plate',
    thicknessBandMm: { over: null, upTo: 100 },
    yield: { minMPa: 345, kind: 'ReH' },
    tensileStrength: { minMPa: 450, maxMPa: null },
    elongation: [
      { minPct: 18, basis: { kind: 'fixed', lengthMm: 200 } },
      { minPct: 21, basis: { kind: 'fixed', lengthMm: 50 } },
    ],
    reductionOfAreaMinPct: null,
    hardness: null,
    source: RECALLED,
  },
  {
    designation: 'A240-304',
    standard: 'ASTM A240/A240M',
    edition: null,
    grade: 'Type 304 (S30400)',
    productForm: 'plate, sheet and strip',
    thicknessBandMm: null,
    yield: { minMPa: 205, kind: 'Rp0.2' },
    tensileStrength: { minMPa: 515, maxMPa: null },
    elongation: [{ minPct: 40, basis: { kind: 'fixed', lengthMm: 50 } }],
    reductionOfAreaMinPct: null,
    hardness: { min: null, max: 201, scale: 'HBW' },
    source: RECALLED,
  },
  {
    designation: 'A240-316L',
    standard: 'ASTM A240/A240M',
    edition: null,
    grade: 'Type 316L (S31603)',
    productForm: 'plate, sheet and strip',
    thicknessBandMm: null,
    yield: { minMPa: 170, kind: 'Rp0.2' },
    tensileStrength: { minMPa: 485, maxMPa: null },
    elongation: [{ minPct: 40, basis: { kind: 'fixed', lengthMm: 50 } }],
    reductionOfAreaMinPct: null,
    hardness: { min: null, max: 217, scale: 'HBW' },
    source: RECALLED,
  },
  {
    designation: 'B209-6061-T6',
    standard: 'ASTM B209/B209M',
    edition: null,
    grade: '6061-T6',
    productForm: 'sheet',
    thicknessBandMm: { over: 1.6, upTo: 6.3 },
    yield: { minMPa: 240, kind: 'Rp0.2' },
    tensileStrength: { minMPa: 290, maxMPa: null },
    elongation: [{ minPct: 10, basis: { kind: 'fixed', lengthMm: 50 } }],
    reductionOfAreaMinPct: null,
    hardness: null,
    source: RECALLED,
  },
  {
    designation: 'A193-B7',
    standard: 'ASTM A193/A193M',
    edition: null,
    grade: 'B7',
    productForm: 'bolting bar',
    thicknessBandMm: { over: null, upTo: 64 },
    yield: { minMPa: 720, kind: 'Rp0.2' },
    tensileStrength: { minMPa: 860, maxMPa: null },
    elongation: [{ minPct: 16, basis: { kind: 'diameters', multiple: 4 } }],
    reductionOfAreaMinPct: 50,
    hardness: { min: null, max: 321, scale: 'HBW' },
    source: RECALLED,
  },
  {
    designation: 'S235JR',
    standard: 'EN 10025-2',
    edition: null,
    grade: 'S235JR',
    productForm: 'flat and long products',
    thicknessBandMm: { over: null, upTo: 16 },
    yield: { minMPa: 235, kind: 'ReH' },
    tensileStrength: { minMPa: 360, maxMPa: 510 },
    elongation: [{ minPct: 26, basis: { kind: 'proportional', k: 5.65 } }],
    reductionOfAreaMinPct: null,
    hardness: null,
    source: RECALLED,
  },
  {
    designation: 'S355J2',
    standard: 'EN 10025-2',
    edition: null,
    grade: 'S355J2',
    productForm: 'flat and long products',
    thicknessBandMm: { over: null, upTo: 16 },
    yield: { minMPa: 355, kind: 'ReH' },
    tensileStrength: { minMPa: 470, maxMPa: 630 },
    elongation: [{ minPct: 22, basis: { kind: 'proportional', k: 5.65 } }],
    reductionOfAreaMinPct: null,
    hardness: null,
    source: RECALLED,
  },
  {
    designation: '42CrMo4+QT',
    standard: 'EN 10083-3',
    edition: null,
    grade: '42CrMo4 / 42CrMoS4, quenched and tempered',
    productForm: 'bar',
    thicknessBandMm: { over: null, upTo: 16 },
    yield: { minMPa: 900, kind: 'Rp0.2' },
    tensileStrength: { minMPa: 1100, maxMPa: 1300 },
    elongation: [{ minPct: 10, basis: { kind: 'proportional', k: 5.65 } }],
    reductionOfAreaMinPct: 40,
    hardness: null,
    source: RECALLED,
  },
]

const normalise = (text: string) => text.toLowerCase().replace(/[\s_-]/g, '')

/** Finds a starter record by designation, ignoring case, spaces and hyphens. */
export function findSpecification(designation: string): SpecificationRecord | null {
  return (
    STARTER_SPECIFICATIONS.find((spec) => normalise(spec.designation) === normalise(designation)) ??
    null
  )
}
