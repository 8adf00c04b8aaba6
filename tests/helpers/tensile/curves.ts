import { seededGaussian } from './random'

/** A synthetic engineering curve with the properties it was built to have. */
export interface SyntheticCurve {
  strain: number[]
  stressMPa: number[]
  expected: {
    modulusMPa: number
    rp02MPa: number
    rmMPa: number
    agPct: number
    aPct: number
    proportionalLimitMPa: number
  }
}

export interface RambergOsgoodSpec {
  modulusMPa: number
  sigma0MPa: number
  n: number
  /** Plastic strain at maximum force, percent (Ag). */
  agPct: number
  /** Engineering strain (fraction) at which the specimen breaks, after necking. */
  fractureStrain: number
  /** Stress at fracture as a fraction of Rm. */
  fractureStressRatio: number
  samples: number
}

/** Ramberg–Osgood strain ε = σ/E + 0.002 (σ/σ0)^n (Ramberg & Osgood, NACA TN 902; Hill, NACA TN 927). */
export function rambergOsgoodStrain(stress: number, spec: RambergOsgoodSpec): number {
  return stress / spec.modulusMPa + 0.002 * (stress / spec.sigma0MPa) ** spec.n
}

/** Inverts the Ramberg–Osgood relation by bisection (it is monotonic in σ). */
export function rambergOsgoodStress(strain: number, spec: RambergOsgoodSpec, top: number): number {
  let low = 0
  let high = top
  for (let k = 0; k < 80; k++) {
    const mid = (low + high) / 2
    if (rambergOsgoodStrain(mid, spec) < strain) low = mid
    else high = mid
  }
  return (low + high) / 2
}

/**
 * Rising Ramberg–Osgood branch up to the stress whose plastic strain is Ag, then a necking
 * branch that falls as a parabola from that maximum to the fracture point, then a drop to a
 * few percent of Rm. Samples are spread evenly in stress on the rising branch and in strain
 * everywhere, as a machine sampling in time would give both dense elastic and plastic data.
 */
export function rambergOsgoodCurve(spec: RambergOsgoodSpec): SyntheticCurve {
  const rm = spec.sigma0MPa * (spec.agPct / 100 / 0.002) ** (1 / spec.n)
  const strainAtRm = rambergOsgoodStrain(rm, spec)
  const points: [number, number][] = []
  const half = Math.floor(spec.samples / 2)
  for (let k = 0; k <= half; k++) {
    const stress = (rm * k) / half
    points.push([rambergOsgoodStrain(stress, spec), stress])
  }
  for (let k = 1; k < half; k++) {
    const strain = (strainAtRm * k) / half
    points.push([strain, rambergOsgoodStress(strain, spec, rm)])
  }
  points.sort((a, b) => a[0] - b[0])
  const fractureStress = rm * spec.fractureStressRatio
  const neckSamples = Math.max(20, Math.floor(spec.samples / 4))
  const span = spec.fractureStrain - strainAtRm
  for (let k = 1; k <= neckSamples; k++) {
    const strain = strainAtRm + (span * k) / neckSamples
    points.push([strain, rm - (rm - fractureStress) * (k / neckSamples) ** 2])
  }
  for (let k = 1; k <= 5; k++) points.push([spec.fractureStrain + 0.0005 * k, rm * 0.02])
  return {
    strain: points.map((p) => p[0]),
    stressMPa: points.map((p) => p[1]),
    expected: {
      modulusMPa: spec.modulusMPa,
      rp02MPa: spec.sigma0MPa,
      rmMPa: rm,
      agPct: spec.agPct,
      aPct: (spec.fractureStrain - fractureStress / spec.modulusMPa) * 100,
      proportionalLimitMPa: spec.sigma0MPa * 0.05 ** (1 / spec.n),
    },
  }
}

/**
 * Adds a toe: slack at the start shifts every strain by `shift`, and below `toeStress` the
 * shift builds up as √(σ/σt), so the record starts at zero strain with a shallow slope.
 * Toe compensation (ASTM E8/E8M) should recover the curve without it.
 */
export function withToe(curve: SyntheticCurve, shift: number, toeStress: number): SyntheticCurve {
  let seated = false
  const strain = curve.strain.map((e, i) => {
    const stress = Math.max(curve.stressMPa[i] ?? 0, 0)
    seated ||= stress >= toeStress
    return e + shift * (seated ? 1 : Math.sqrt(stress / toeStress))
  })
  return { ...curve, strain }
}

/** Gaussian noise on stress with a standard deviation of `fraction` × Rm, fixed seed. */
export function withStressNoise(
  curve: SyntheticCurve,
  fraction: number,
  seed: number,
): SyntheticCurve {
  const gaussian = seededGaussian(seed)
  const sd = fraction * curve.expected.rmMPa
  return { ...curve, stressMPa: curve.stressMPa.map((s) => s + sd * gaussian()) }
}
