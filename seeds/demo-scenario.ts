import type { CaseCreate } from '../shared/schemas/cases'
import type { ServiceEventCreate } from '../shared/schemas/service-events'
import type { Role } from '../shared/schemas/roles'
import type { CaseState } from '../shared/workflow/case-states'

// An invented scenario: the lab, its clients, people, parts and parties are all made up.
export const DEMO_LAB_NAME = 'Kestrelmoor Materials Laboratory'

export const ORGANISATIONS = [
  {
    key: 'cranes',
    name: 'Tallowmere Cranes Ltd',
    contactName: 'Dale Forsyth',
    contactEmail: 'client@demo.test',
  },
  {
    key: 'fittings',
    name: 'Quillon Process Fittings',
    contactName: 'Yuki Brennagh',
    contactEmail: 'client2@demo.test',
  },
] as const

export type OrganisationKey = (typeof ORGANISATIONS)[number]['key']

export interface DemoPerson {
  key: string
  email: string
  name: string
  roles: Role[]
  organisation?: OrganisationKey
}

export const PEOPLE: DemoPerson[] = [
  { key: 'admin', email: 'admin@demo.test', name: 'Ines Haldane', roles: ['admin'] },
  { key: 'tomas', email: 'investigator@demo.test', name: 'Tomas Reyke', roles: ['investigator'] },
  { key: 'priya', email: 'lab@demo.test', name: 'Priya Olund', roles: ['lab'] },
  {
    key: 'maren',
    email: 'reviewer@demo.test',
    name: 'Maren Costa',
    roles: ['reviewer', 'investigator'],
  },
  { key: 'anwen', email: 'reviewer2@demo.test', name: 'Anwen Tarrock', roles: ['reviewer'] },
  {
    key: 'dale',
    email: 'client@demo.test',
    name: 'Dale Forsyth',
    roles: ['client'],
    organisation: 'cranes',
  },
  {
    key: 'yuki',
    email: 'client2@demo.test',
    name: 'Yuki Brennagh',
    roles: ['client'],
    organisation: 'fittings',
  },
]

type PersonKey = 'tomas' | 'priya' | 'maren' | 'anwen'

/** A demo case: its fields, who is on it, and dates as days relative to the day of seeding. */
export interface DemoCase extends Omit<
  Partial<CaseCreate>,
  | 'organisationId'
  | 'leadInvestigatorId'
  | 'coInvestigatorIds'
  | 'labTechnicianId'
  | 'reviewerId'
  | 'receivedOn'
  | 'failureDate'
  | 'dueDate'
> {
  title: string
  component: string
  material: string
  organisation: OrganisationKey
  lead: PersonKey
  coInvestigators?: PersonKey[]
  lab?: PersonKey
  reviewer?: PersonKey
  failedDaysAgo: number
  receivedDaysAgo: number
  dueInDays: number
  /** reached through the real transitions, one step at a time */
  status: Extract<CaseState, 'intake' | 'examination' | 'drafting'>
  /** the part's life before it failed; `daysAgo` relative to the day of seeding */
  history?: (Omit<Partial<ServiceEventCreate>, 'occurredOn'> &
    Pick<ServiceEventCreate, 'kind' | 'description'> & { daysAgo: number })[]
}

export const CASES: DemoCase[] = [
  {
    organisation: 'cranes',
    title: 'Fractured hook block pin, gantry crane 3',
    component: 'Hook block pin',
    partNumber: 'TC-HB-2207',
    material: 'AISI 4140, quenched and tempered',
    heatOrLot: 'H 61873',
    clientReference: 'TC-NCR-2291',
    contactName: 'Dale Forsyth',
    contactEmail: 'client@demo.test',
    componentFunction: 'Carries the bottom hook block on the main hoist.',
    failureLocation: 'Container yard, gantry crane 3',
    howFound: 'The pin parted during a lift of about 60 % of the rated load; the load was landed.',
    scope: 'Visual and fractographic examination, metallography, tensile and hardness tests.',
    turnaround: 'expedited',
    safetyCritical: true,
    lead: 'tomas',
    lab: 'priya',
    reviewer: 'maren',
    failedDaysAgo: 48,
    receivedDaysAgo: 41,
    dueInDays: 3,
    status: 'examination',
    history: [
      {
        kind: 'manufacture',
        daysAgo: 3420,
        description: 'Pin machined from bar and quenched and tempered by the crane builder.',
        source: 'Builder’s material certificate',
        clientVisible: true,
      },
      {
        kind: 'installation',
        daysAgo: 3290,
        description: 'Crane 3 commissioned with the original hook block.',
        hours: 0,
        cycles: 0,
        clientVisible: true,
      },
      {
        kind: 'inspection',
        daysAgo: 410,
        description: 'Annual thorough examination; pin bore greased, no defects reported.',
        hours: 36_800,
        cycles: 512_000,
        source: 'Inspection report TE-22/118',
      },
      {
        kind: 'incident',
        daysAgo: 95,
        description: 'Snatch load when a container caught on the cell guide; crane stopped.',
        load: 'about 1.3 × safe working load (estimated)',
      },
      {
        kind: 'failure',
        daysAgo: 48,
        description: 'Pin parted during a routine lift; load landed without injury.',
        hours: 40_150,
        cycles: 561_300,
        environment: 'outdoor, coastal',
        temperatureC: 9,
        clientVisible: true,
      },
    ],
    interestedParties: [
      {
        name: 'Rhoswen Aldgate',
        organisation: 'Quernhythe Terminal Operations',
        email: 'r.aldgate@quernhythe.example',
        role: 'operator',
      },
      {
        name: 'Cormac Pellew',
        organisation: 'Ellerwick Mutual Assurance',
        email: 'claims@ellerwick.example',
        role: 'insurer',
      },
    ],
  },
  {
    organisation: 'cranes',
    title: 'Cracked rope sheave on luffing hoist',
    component: 'Rope sheave',
    partNumber: 'TC-SH-0415',
    material: 'EN-GJS-500-7',
    clientReference: 'TC-NCR-2244',
    turnaround: 'standard',
    lead: 'maren',
    coInvestigators: ['tomas'],
    lab: 'priya',
    reviewer: 'anwen',
    failedDaysAgo: 92,
    receivedDaysAgo: 80,
    dueInDays: -2,
    status: 'drafting',
    mechanisms: [{ mechanism: 'fatigue_high_cycle', primary: true }],
  },
  {
    organisation: 'cranes',
    title: 'Sheared boom foot bolt',
    component: 'Boom foot bolt M30',
    partNumber: 'TC-BF-3001',
    material: 'ISO 898-1 property class 10.9',
    clientReference: 'TC-NCR-2198',
    turnaround: 'rush',
    safetyCritical: true,
    lead: 'tomas',
    lab: 'priya',
    reviewer: 'maren',
    failedDaysAgo: 160,
    receivedDaysAgo: 152,
    dueInDays: 10,
    status: 'drafting',
    mechanisms: [
      { mechanism: 'ductile_overload', primary: true },
      { mechanism: 'fatigue_low_cycle', primary: false },
    ],
    rootCause: 'assembly',
  },
  {
    organisation: 'cranes',
    title: 'Bent outrigger beam after set-down',
    component: 'Outrigger beam',
    material: 'EN 10025-2 S355J2',
    turnaround: 'standard',
    lead: 'tomas',
    failedDaysAgo: 11,
    receivedDaysAgo: 5,
    dueInDays: 52,
    status: 'intake',
  },
  {
    organisation: 'fittings',
    title: 'Cracked compression fitting on chloride line',
    component: 'Compression fitting 1/2 in',
    partNumber: 'QF-CF-316-08',
    material: 'ASTM A479 Type 316L bar',
    clientReference: 'QPF-Q-7731',
    contactName: 'Yuki Brennagh',
    contactEmail: 'client2@demo.test',
    turnaround: 'expedited',
    decisionRule: 'guard_band',
    lead: 'maren',
    lab: 'priya',
    reviewer: 'anwen',
    failedDaysAgo: 95,
    receivedDaysAgo: 86,
    dueInDays: -5,
    status: 'examination',
  },
  {
    organisation: 'fittings',
    title: 'Leak at heat-exchanger nozzle weld',
    component: 'Nozzle weld N2',
    material: 'ASTM A240 Type 304 plate, GTAW weld',
    turnaround: 'standard',
    lead: 'tomas',
    failedDaysAgo: 6,
    receivedDaysAgo: 3,
    dueInDays: 70,
    status: 'intake',
  },
  {
    organisation: 'fittings',
    title: 'Transfer pump shaft fracture',
    component: 'Pump shaft',
    partNumber: 'QF-PS-42-1180',
    material: '42CrMo4 (EN 10083-3), quenched and tempered',
    clientReference: 'QPF-Q-7702',
    turnaround: 'standard',
    lead: 'tomas',
    coInvestigators: ['maren'],
    lab: 'priya',
    reviewer: 'anwen',
    failedDaysAgo: 140,
    receivedDaysAgo: 131,
    dueInDays: 5,
    status: 'drafting',
    history: [
      {
        kind: 'installation',
        daysAgo: 1460,
        description: 'Transfer pump P-12 installed on the acid transfer line.',
        hours: 0,
        clientVisible: true,
      },
      {
        kind: 'repair',
        daysAgo: 700,
        description: 'Coupling replaced after vibration alarm; shaft not changed.',
        hours: 16_200,
        source: 'Maintenance work order 4471',
      },
      {
        kind: 'failure',
        daysAgo: 140,
        description: 'Shaft fractured at the keyway run-out behind the coupling.',
        hours: 28_900,
        temperatureC: 45,
        environment: 'dilute sulphuric acid service',
        clientVisible: true,
      },
    ],
    mechanisms: [{ mechanism: 'fatigue_high_cycle', primary: true }],
    rootCause: 'design',
  },
]
