import type { RambergOsgoodSpec } from './curves'

/*
 * Ramberg–Osgood parameters for three invented materials of the kinds a failure lab meets:
 * a structural steel, an aluminium alloy and a quenched-and-tempered steel. The values are
 * plausible, not taken from any product; the tests check only what the curve implies.
 */
export const STRUCTURAL_STEEL: RambergOsgoodSpec = {
  modulusMPa: 200_000,
  sigma0MPa: 355,
  n: 12,
  agPct: 15,
  fractureStrain: 0.28,
  fractureStressRatio: 0.75,
  samples: 3000,
}

export const ALUMINIUM_ALLOY: RambergOsgoodSpec = {
  modulusMPa: 70_000,
  sigma0MPa: 270,
  n: 25,
  agPct: 8,
  fractureStrain: 0.12,
  fractureStressRatio: 0.85,
  samples: 3000,
}

export const TEMPERED_STEEL: RambergOsgoodSpec = {
  modulusMPa: 205_000,
  sigma0MPa: 1100,
  n: 20,
  agPct: 5,
  fractureStrain: 0.13,
  fractureStressRatio: 0.7,
  samples: 3000,
}

/*
 * Rounded curves: no sharp end to the linear part, as austenitic stainless steels and many
 * aluminium alloys show (Ramberg–Osgood n about 5 to 10). Invented, plausible values; the
 * tests set n.
 */
export const ROUNDED_STAINLESS: RambergOsgoodSpec = {
  modulusMPa: 193_000,
  sigma0MPa: 260,
  n: 6,
  agPct: 40,
  fractureStrain: 0.5,
  fractureStressRatio: 0.8,
  samples: 3000,
}

export const ROUNDED_ALUMINIUM: RambergOsgoodSpec = {
  modulusMPa: 70_000,
  sigma0MPa: 270,
  n: 8,
  agPct: 8,
  fractureStrain: 0.12,
  fractureStressRatio: 0.85,
  samples: 3000,
}
