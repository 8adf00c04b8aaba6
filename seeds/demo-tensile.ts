import type { Knex } from 'knex'
import type { Actor } from '../shared/access/policy'
import { HardnessCreate } from '../shared/schemas/hardness'
import { SpecimenCreate } from '../shared/schemas/mechanical-tests'
import { recordHardness } from '../server/services/hardness'
import { confirmRecord, uploadRecord } from '../server/services/mechanical-tests/records'
import { createSpecimen } from '../server/services/mechanical-tests/specimens'
import type { CaseService } from '../server/services/cases'
import { findCase } from '../server/services/cases/case-record'
import { seedStarterSpecifications } from '../server/services/specifications'
import type { FileStorage } from '../server/storage/file-storage'
import { analyseInThread } from '../server/tensile/analyse-upload'

/*
 * Invented tensile records for the demo's hook block pin: three round specimens of a quenched
 * and tempered Cr-Mo steel, written as a testing machine would export them. The curves are a
 * Ramberg–Osgood loading branch up to maximum force, then a necking branch down to fracture; a
 * small seeded ripple stands in for the noise of a real record. Not the open dataset.
 */
const DIAMETER_MM = 6
const GAUGE_MM = 24
const AREA_MM2 = (Math.PI * DIAMETER_MM ** 2) / 4

interface Scenario {
  label: string
  sigma0: number
  n: number
  uniform: number
  fracture: number
  /** measured across the neck after the test, mm */
  finalDiameter: string
  seed: number
}

const SPECIMENS: Scenario[] = [
  {
    label: 'P1',
    sigma0: 780,
    n: 14,
    uniform: 0.065,
    fracture: 0.19,
    finalDiameter: '4.12mm',
    seed: 11,
  },
  {
    label: 'P2',
    sigma0: 792,
    n: 15,
    uniform: 0.062,
    fracture: 0.18,
    finalDiameter: '4.20mm',
    seed: 23,
  },
  {
    label: 'P3',
    sigma0: 771,
    n: 13,
    uniform: 0.068,
    fracture: 0.2,
    finalDiameter: '4.05mm',
    seed: 37,
  },
]

function ripple(seed: number) {
  let state = seed
  return () => {
    state = (state * 1103515245 + 12345) % 2147483648
    return state / 2147483648 - 0.5
  }
}

/** Strain and stress (MPa) of one invented specimen, 4000 points. */
function curve(s: Scenario): [number, number][] {
  const E = 205_000
  const strainOf = (stress: number) => stress / E + 0.002 * (stress / s.sigma0) ** s.n
  let rm = s.sigma0
  while (strainOf(rm) < s.uniform) rm += 0.5
  const points: [number, number][] = []
  for (let k = 0; k <= 2500; k++) points.push([strainOf((rm * k) / 2500), (rm * k) / 2500])
  for (let k = 1; k <= 1500; k++) {
    const t = k / 1500
    points.push([s.uniform + (s.fracture - s.uniform) * t, rm * (1 - 0.22 * t ** 1.6)])
  }
  return points
}

function exportText(s: Scenario, testedOn: string): string {
  const noise = ripple(s.seed)
  const head = [
    `Specimen;${s.label}`,
    `Test date;${testedOn}`,
    'Standard;ISO 6892-1',
    'Temperature;21;°C',
    'Time [s];Extension [mm];Force [kN]',
  ]
  const rows = curve(s).map(([strain, stress], i) => {
    const force = ((stress + noise() * 1.5) * AREA_MM2) / 1000
    const cells = [(i * 0.05).toFixed(2), (strain * GAUGE_MM).toFixed(5), force.toFixed(4)]
    return cells.join(';').replaceAll('.', ',')
  })
  return `${[...head, ...rows].join('\r\n')}\r\n`
}

/** Specimens cut from the pin, their raw exports uploaded and analysed, and confirmed by the lab. */
export async function seedDemoTensile(
  trx: Knex,
  caseId: number,
  lab: Actor,
  storage: FileStorage,
  testedOn: string,
): Promise<void> {
  const ctx = { actor: lab, db: trx }
  const deps = { storage, analyse: analyseInThread }
  // The verdict comes from the case's linked record (see linkDemoMaterial), not an engine option.
  const common = {
    diameter: `${DIAMETER_MM}mm`,
    gaugeLength: `${GAUGE_MM}mm`,
    uncertainty: '12MPa,1%',
    uncertaintySource: 'the demo laboratory’s invented budget',
  }
  for (const scenario of SPECIMENS) {
    const specimen = await createSpecimen(
      ctx,
      caseId,
      SpecimenCreate.parse({
        label: scenario.label,
        location: 'Pin shank, mid-radius, 40 mm from the fracture',
        orientation: 'longitudinal',
        testedOn,
        temperatureC: 21,
        machine: 'Frame 1 (100 kN)',
        extensometer: 'Clip-on, 25 mm class 0.5',
        standard: 'ISO 6892-1',
      }),
    )
    const bytes = Buffer.from(exportText(scenario, testedOn), 'utf8')
    const file = { buffer: bytes, originalname: `pin-${scenario.label}.csv` }
    const ids = { caseId, specimenId: specimen.id }
    const options = { ...common, finalDiameter: scenario.finalDiameter }
    const { id } = await uploadRecord(deps, ctx, ids, file, JSON.stringify(options))
    await confirmRecord(ctx, caseId, id, 1)
  }
  // Hardness across the pin: harder at the surface than at the core, as for a quenched and
  // tempered bar of this size (invented readings).
  for (const [location, values] of [
    ['Pin shank, 1 mm below the surface', [31.5, 32, 31]],
    ['Pin shank, mid-radius', [29.5, 30, 29]],
    ['Pin shank, core', [28, 28.5, 27.5]],
  ] as const) {
    const input = HardnessCreate.parse({
      scale: 'HRC',
      values,
      location,
      load: '150 kgf',
      testedOn,
    })
    await recordHardness(ctx, caseId, input)
  }
}

/**
 * The investigator links the pin's material to the library's A193-B7 record (its one band, up to
 * 64 mm) for the pin's invented 55 mm diameter, so the demo's results carry a verdict.
 */
export async function linkDemoMaterial(
  trx: Knex,
  cases: CaseService,
  caseId: number,
  lead: Actor,
): Promise<void> {
  await seedStarterSpecifications(trx)
  const record = (await trx('specifications').where({ designation: 'A193-B7' }).first('id')) as
    { id: number } | undefined
  if (!record) throw new Error('demo: the library has no A193-B7 record to link the pin to')
  const { version } = await findCase(trx, caseId)
  const link = { specificationId: record.id, specificationBand: 0, sectionSizeMm: 55 }
  await cases.update({ actor: lead, db: trx }, caseId, { ...link, version })
}
