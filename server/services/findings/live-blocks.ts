import type { Knex } from 'knex'
import {
  LIVE_BLOCK_TITLES,
  type LiveBlockKind,
  type LiveBlockSnapshot,
  type LiveBlockSnapshots,
} from '../../../shared/findings/live-blocks'
import { todayIso } from '../../../shared/schemas/dates'
import { SERVICE_EVENT_KIND_LABELS } from '../../../shared/schemas/service-events'
import { serviceLife } from '../../../shared/service-history/service-life'
import { formatValue, type SpecimenResult, type TensileReport } from '../../../shared/tensile'
import { judgeAgainstLink } from '../../../shared/specifications/case-conformity'
import { conformityLines } from '../../../shared/specifications/conformity-lines'
import { loadCaseMaterial } from '../mechanical-tests/material-link'
import { isoDay } from '../mechanical-tests/rows'

type Reader = (db: Knex, caseId: number, now: Date) => Promise<Omit<LiveBlockSnapshot, 'takenAt'>>

const text = (value: unknown) => (value === null || value === undefined ? '—' : String(value))

interface ServiceRow {
  kind: keyof typeof SERVICE_EVENT_KIND_LABELS
  occurredOn: string | Date
  description: string
  hours: string | number | null
  cycles: string | number | null
}

const serviceHistory: Reader = async (db, caseId, now) => {
  const rows = (await db('service_events')
    .where({ caseId })
    .orderBy('occurredOn')
    .orderBy('id')) as ServiceRow[]
  const events = rows.map((row) => ({
    kind: row.kind,
    occurredOn: isoDay(row.occurredOn) as string,
    hours: row.hours === null ? null : Number(row.hours),
    cycles: row.cycles === null ? null : Number(row.cycles),
  }))
  const failure = (await db('cases').where({ id: caseId }).first('failureDate')) as
    { failureDate: string | Date | null } | undefined
  const life = serviceLife(events, {
    failureDate: isoDay(failure?.failureDate ?? null),
    today: todayIso(now),
  })
  const notes = life.from
    ? [
        `In service from ${life.from} to ${life.to}${life.ended ? '' : ' (no failure recorded yet)'}: ` +
          [
            life.years === null ? null : `${life.years} years`,
            life.hours === null ? null : `${life.hours} hours`,
            life.cycles === null ? null : `${life.cycles} cycles`,
          ]
            .filter(Boolean)
            .join(', ') +
          '.',
      ]
    : []
  return {
    kind: 'service_history',
    title: LIVE_BLOCK_TITLES.service_history,
    columns: ['Date', 'Event', 'Hours', 'Cycles', 'Description'],
    rows: rows.map((row, index) => [
      events[index]?.occurredOn ?? '—',
      SERVICE_EVENT_KIND_LABELS[row.kind] ?? row.kind,
      text(events[index]?.hours),
      text(events[index]?.cycles),
      row.description,
    ]),
    notes,
  }
}

const samples: Reader = async (db, caseId) => {
  const rows = (await db('samples').where({ caseId }).orderBy('id')) as {
    itemId: string
    description: string
    receivedFrom: string
    receivedOn: string | Date
    condition: string | null
  }[]
  return {
    kind: 'samples',
    title: LIVE_BLOCK_TITLES.samples,
    columns: ['Item', 'Description', 'Received from', 'Received on', 'Condition on receipt'],
    rows: rows.map((row) => [
      row.itemId,
      row.description,
      row.receivedFrom,
      text(isoDay(row.receivedOn)),
      text(row.condition),
    ]),
    notes: [],
  }
}

const VERDICT_WORDS = {
  pass: 'meets',
  fail: 'does not meet',
  inconclusive: 'inconclusive',
  incomplete: 'incomplete',
} as const

/** The yield value a report shows: ReH/ReL for discontinuous yielding, else the offset proof strength. */
function yieldCell(result: SpecimenResult): string {
  if (result.discontinuousYielding && result.upperYieldMPa !== null)
    return `ReH ${formatValue(result.upperYieldMPa, 'strength', 'si')}`
  return `Rp${result.offsetPct} ${formatValue(result.yieldStrengthMPa, 'strength', 'si')}`
}

function specimenResults(report: TensileReport): SpecimenResult[] {
  return Array.isArray(report)
    ? (report.filter((item) => 'modulusGPa' in item) as SpecimenResult[])
    : [report]
}

const tensileResults: Reader = async (db, caseId) => {
  const rows = (await db('tensile_records')
    .join('specimens', 'specimens.id', 'tensile_records.specimenId')
    .where({ 'tensile_records.caseId': caseId, 'tensile_records.state': 'confirmed' })
    .where('tensile_records.superseded', false)
    .orderBy('specimens.label')
    .orderBy('tensile_records.id')
    .select(
      'tensile_records.result',
      'tensile_records.options',
      'specimens.label',
      'specimens.standard',
    )) as {
    result: string
    options: string | Record<string, string>
    label: string
    standard: string | null
  }[]
  const material = await loadCaseMaterial(db, caseId)
  const table: string[][] = []
  const notes = new Set<string>()
  for (const row of rows) {
    const options = typeof row.options === 'string' ? JSON.parse(row.options) : row.options
    for (const result of specimenResults(JSON.parse(row.result) as TensileReport)) {
      const judged = judgeAgainstLink(result, options as Record<string, string>, material)
      table.push([
        row.label,
        text(row.standard),
        formatValue(result.modulusGPa, 'modulus', 'si'),
        yieldCell(result),
        formatValue(result.tensileStrengthMPa, 'strength', 'si'),
        formatValue(result.elongationAfterFracturePct, 'elongation', 'si'),
        formatValue(result.reductionOfAreaPct, 'reduction', 'si'),
        judged.judged ? VERDICT_WORDS[judged.conformity.overall] : 'not judged',
      ])
      for (const line of conformityLines(judged)) notes.add(line)
    }
  }
  if (table.length)
    notes.add('Only confirmed test records are shown. Values rounded as ISO 6892-1 reports them.')
  return {
    kind: 'tensile_results',
    title: LIVE_BLOCK_TITLES.tensile_results,
    columns: ['Specimen', 'Standard', 'E', 'Yield', 'Rm', 'A', 'Z', 'Specification'],
    rows: table,
    notes: [...notes],
  }
}

const READERS: Record<LiveBlockKind, Reader> = {
  tensile_results: tensileResults,
  service_history: serviceHistory,
  samples,
}

/** The current data of the live blocks a draft uses (each read once). */
export async function readLiveBlocks(
  db: Knex,
  caseId: number,
  kinds: Iterable<LiveBlockKind>,
  now = new Date(),
): Promise<LiveBlockSnapshots> {
  const snapshots: LiveBlockSnapshots = {}
  for (const kind of new Set(kinds)) {
    snapshots[kind] = { ...(await READERS[kind](db, caseId, now)), takenAt: now.toISOString() }
  }
  return snapshots
}
