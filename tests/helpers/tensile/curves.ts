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

export interface YieldPointSpec {
  modulusMPa: number
  upperYieldMPa: number
  /** The initial transient: the first minimum after ReH, lower than ReL (ISO 6892-1 ignores it). */
  transientMPa: number
  /** Highs and lows of the serrated plateau; the lowest low is ReL. */
  plateauHighs: readonly number[]
  plateauLows: readonly number[]
  /** Engineering strain where the plateau ends and uniform hardening starts. */
  plateauEndStrain: number
  rmMPa: number
  strainAtRm: number
  fractureStrain: number
}

function segment(points: [number, number][], to: [number, number], samples: number): void {
  const [e0, s0] = points.at(-1) ?? [0, 0]
  for (let k = 1; k <= samples; k++) {
    const t = k / samples
    points.push([e0 + t * (to[0] - e0), s0 + t * (to[1] - s0)])
  }
}

/**
 * A curve with discontinuous yielding built from known pieces: a straight elastic line to
 * ReH, a sudden drop to the transient minimum, a serrated plateau whose lowest trough is ReL,
 * then hardening that starts abruptly at the plateau end (so the tangent construction of
 * ASTM E8/E8M ends the yield-point elongation exactly there), necking and fracture.
 */
export function yieldPointCurve(spec: YieldPointSpec): { strain: number[]; stressMPa: number[] } {
  const points: [number, number][] = [[0, 0]]
  const yieldStrain = spec.upperYieldMPa / spec.modulusMPa
  segment(points, [yieldStrain, spec.upperYieldMPa], 300)
  segment(points, [yieldStrain + 0.0002, spec.transientMPa], 4)
  const teeth = spec.plateauHighs.length
  const start = yieldStrain + 0.0002
  const pitch = (spec.plateauEndStrain - start) / teeth
  spec.plateauHighs.forEach((high, k) => {
    segment(points, [start + pitch * (k + 0.8), high], 16)
    segment(points, [start + pitch * (k + 1), spec.plateauLows[k]!], 4)
  })
  const [endStrain, endStress] = points.at(-1)!
  const span = spec.strainAtRm - endStrain
  for (let k = 1; k <= 600; k++) {
    const t = k / 600
    points.push([endStrain + span * t, endStress + (spec.rmMPa - endStress) * (1 - (1 - t) ** 2)])
  }
  segment(points, [spec.fractureStrain, spec.rmMPa * 0.8], 200)
  segment(points, [spec.fractureStrain + 0.001, spec.rmMPa * 0.02], 2)
  return { strain: points.map((p) => p[0]), stressMPa: points.map((p) => p[1]) }
}

/**
 * Hollomon curve σ = K εⁿ in true stress and true strain (Hollomon, 1945), elastic below the
 * intersection with σ = E ε, converted to engineering values; past maximum force the
 * engineering stress falls by itself (Considère: at true strain n), then the specimen breaks.
 */
export function hollomonCurve(modulusMPa: number, kMPa: number, n: number, samples: number) {
  const yieldTrueStrain = (kMPa / modulusMPa) ** (1 / (1 - n))
  const lastTrueStrain = n * 1.6
  const strain: number[] = []
  const stressMPa: number[] = []
  for (let k = 0; k <= samples; k++) {
    const e =
      k < samples / 5
        ? (yieldTrueStrain * k) / (samples / 5)
        : yieldTrueStrain +
          ((lastTrueStrain - yieldTrueStrain) * (k - samples / 5)) / (samples * 0.8)
    const trueStress = e <= yieldTrueStrain ? modulusMPa * e : kMPa * e ** n
    strain.push(Math.expm1(e))
    stressMPa.push(trueStress / Math.exp(e))
  }
  strain.push(strain.at(-1)! + 0.001)
  stressMPa.push(stressMPa.at(-1)! * 0.02)
  return { strain, stressMPa }
}
