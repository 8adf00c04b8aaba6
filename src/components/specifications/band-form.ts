import {
  SPEC_YIELD_KINDS,
  type SpecificationBand,
  type SpecificationCreate,
} from '../../../shared/schemas/specifications'

export type YieldKindName = (typeof SPEC_YIELD_KINDS)[number]
export type BasisKind = 'fixed' | 'proportional' | 'diameters'

export const BASIS_LABELS: Record<BasisKind, string> = {
  fixed: 'fixed length, mm',
  proportional: 'k·√S0, give k',
  diameters: 'multiple of the diameter',
}

export interface ElongationForm {
  minPct: number | null
  basisKind: BasisKind
  basisValue: number | null
}

/** One band as the form holds it: numbers may be blank while the person types. */
export interface BandForm {
  overMm: number | null
  upToMm: number | null
  yieldMin: number | null
  yieldKind: YieldKindName
  tensileMin: number | null
  tensileMax: number | null
  elongation: ElongationForm[]
  reductionOfAreaMinPct: number | null
  hardnessScale: string
  hardnessMin: number | null
  hardnessMax: number | null
}

export type RecordForm = Omit<SpecificationCreate, 'bands' | 'edition'> & {
  edition: string
  bands: BandForm[]
}

export const emptyBand = (): BandForm => ({
  overMm: null,
  upToMm: null,
  yieldMin: null,
  yieldKind: 'Rp0.2',
  tensileMin: null,
  tensileMax: null,
  elongation: [{ minPct: null, basisKind: 'proportional', basisValue: 5.65 }],
  reductionOfAreaMinPct: null,
  hardnessScale: '',
  hardnessMin: null,
  hardnessMax: null,
})

export const emptyRecord = (): RecordForm => ({
  designation: '',
  standard: '',
  edition: '',
  grade: '',
  productForm: '',
  units: 'MPa',
  bands: [emptyBand()],
  source: '',
})

function basisValueOf(basis: SpecificationBand['elongation'][number]['basis']): number {
  if (basis.kind === 'fixed') return basis.lengthMm
  return basis.kind === 'proportional' ? basis.k : basis.multiple
}

export function bandFormOf(band: SpecificationBand): BandForm {
  return {
    overMm: band.overMm,
    upToMm: band.upToMm,
    yieldMin: band.yield?.min ?? null,
    yieldKind: band.yield?.kind ?? 'Rp0.2',
    tensileMin: band.tensileStrength.min,
    tensileMax: band.tensileStrength.max,
    elongation: band.elongation.map((e) => ({
      minPct: e.minPct,
      basisKind: e.basis.kind,
      basisValue: basisValueOf(e.basis),
    })),
    reductionOfAreaMinPct: band.reductionOfAreaMinPct,
    hardnessScale: band.hardness?.scale ?? '',
    hardnessMin: band.hardness?.min ?? null,
    hardnessMax: band.hardness?.max ?? null,
  }
}

function basisOf(e: ElongationForm) {
  const value = e.basisValue as number
  if (e.basisKind === 'fixed') return { kind: 'fixed' as const, lengthMm: value }
  if (e.basisKind === 'proportional') return { kind: 'proportional' as const, k: value }
  return { kind: 'diameters' as const, multiple: value }
}

/** The band as the API takes it; blanks become "no limit", checked by the shared schema. */
export function bandOf(form: BandForm): unknown {
  const scale = form.hardnessScale.trim()
  return {
    overMm: form.overMm,
    upToMm: form.upToMm,
    yield: form.yieldMin === null ? null : { min: form.yieldMin, kind: form.yieldKind },
    tensileStrength: { min: form.tensileMin, max: form.tensileMax },
    elongation: form.elongation.map((e) => ({ minPct: e.minPct, basis: basisOf(e) })),
    reductionOfAreaMinPct: form.reductionOfAreaMinPct,
    hardness: scale ? { scale, min: form.hardnessMin, max: form.hardnessMax } : null,
  }
}

/** The record's own fields only: the library's bookkeeping (id, checks, version) stays out. */
export function recordFormOf(record: SpecificationCreate): RecordForm {
  return {
    designation: record.designation,
    standard: record.standard,
    edition: record.edition ?? '',
    grade: record.grade,
    productForm: record.productForm,
    units: record.units,
    bands: record.bands.map(bandFormOf),
    source: record.source,
  }
}

export function recordOf(form: RecordForm): unknown {
  return { ...form, edition: form.edition.trim() || null, bands: form.bands.map(bandOf) }
}
