/**
 * Approximate hardness conversion for non-austenitic steels, on the Rockwell C scale, as in
 * ASTM E140 Table 1: HRC, Vickers HV, Brinell HBW (10 mm carbide ball, 3000 kgf).
 *
 * VALUES TYPED FROM MEMORY, not read from a copy of the standard: good for orientation only.
 * An administrator must check them against the current edition before they are relied on.
 * HBW is left out above 615, where the table gives Brinell values only in brackets (beyond the
 * method's recommended range).
 */
export const STEEL_HRC_TABLE_SOURCE =
  'ASTM E140 Table 1 (non-austenitic steels), values typed from memory'

/** [HRC, HV, HBW or null] from soft to hard; every column rises with HRC. */
export const STEEL_HRC_TABLE: readonly (readonly [number, number, number | null])[] = [
  [20, 238, 226],
  [21, 243, 231],
  [22, 248, 237],
  [23, 254, 243],
  [24, 260, 247],
  [25, 266, 253],
  [26, 272, 258],
  [27, 279, 264],
  [28, 286, 271],
  [29, 294, 279],
  [30, 302, 286],
  [31, 310, 294],
  [32, 318, 301],
  [33, 327, 311],
  [34, 336, 319],
  [35, 345, 327],
  [36, 354, 336],
  [37, 363, 344],
  [38, 372, 353],
  [39, 382, 362],
  [40, 392, 371],
  [41, 402, 381],
  [42, 412, 390],
  [43, 423, 400],
  [44, 434, 409],
  [45, 446, 421],
  [46, 458, 432],
  [47, 471, 443],
  [48, 484, 455],
  [49, 498, 469],
  [50, 513, 481],
  [51, 528, 496],
  [52, 544, 512],
  [53, 560, 525],
  [54, 577, 543],
  [55, 595, 560],
  [56, 613, 577],
  [57, 633, 595],
  [58, 653, 615],
  [59, 674, null],
  [60, 697, null],
  [61, 720, null],
  [62, 746, null],
  [63, 772, null],
  [64, 800, null],
  [65, 832, null],
  [66, 865, null],
  [67, 900, null],
  [68, 940, null],
]

/**
 * Tensile strength from Brinell hardness for carbon and low-alloy steels: Rm ≈ 3.45 × HBW MPa
 * (about 500 × HB in psi), the relation the steel tables of ASTM A370 follow closely up to about
 * 450 HBW. Common practice, recalled from memory; an estimate, never a tensile test result.
 */
export const TENSILE_PER_HBW_MPA = 3.45
export const TENSILE_ESTIMATE_MAX_HBW = 450
export const TENSILE_ESTIMATE_SOURCE =
  'Rm ≈ 3.45 × HBW, the relation behind the ASTM A370 steel tables (common practice, from memory)'
