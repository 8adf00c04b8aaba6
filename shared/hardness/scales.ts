/** Hardness scales the lab reports; conversions exist only between some of them (convert.ts). */
export const HARDNESS_SCALES = ['HRC', 'HRB', 'HV', 'HBW', 'HK'] as const
export type HardnessScale = (typeof HARDNESS_SCALES)[number]

export const HARDNESS_SCALE_LABELS: Record<HardnessScale, string> = {
  HRC: 'Rockwell C (HRC)',
  HRB: 'Rockwell B (HRB)',
  HV: 'Vickers (HV)',
  HBW: 'Brinell, tungsten carbide ball (HBW)',
  HK: 'Knoop (HK)',
}
