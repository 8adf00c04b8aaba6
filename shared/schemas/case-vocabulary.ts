// Coded values of the case record and the words people see for them. The mechanism and root-cause
// lists follow the usual vocabulary of failure analysis (common practice, not from one standard).

export const TURNAROUNDS = ['standard', 'expedited', 'rush'] as const
export type Turnaround = (typeof TURNAROUNDS)[number]
export const TURNAROUND_LABELS: Record<Turnaround, string> = {
  standard: 'Standard',
  expedited: 'Expedited',
  rush: 'Rush',
}

/** The rule agreed with the client for conformity statements (ISO/IEC 17025 §7.1.3). */
export const DECISION_RULES = ['simple', 'guard_band'] as const
export type DecisionRule = (typeof DECISION_RULES)[number]
export const DECISION_RULE_LABELS: Record<DecisionRule, string> = {
  simple: 'Simple acceptance',
  guard_band: 'Guard band from measurement uncertainty',
}

export const MECHANISMS = [
  'ductile_overload',
  'brittle_fracture',
  'fatigue_high_cycle',
  'fatigue_low_cycle',
  'fatigue_thermal',
  'fatigue_corrosion',
  'fatigue_fretting',
  'stress_corrosion_cracking',
  'hydrogen_embrittlement',
  'liquid_metal_embrittlement',
  'creep',
  'wear',
  'corrosion_uniform',
  'corrosion_pitting',
  'corrosion_crevice',
  'corrosion_galvanic',
  'corrosion_intergranular',
  'corrosion_selective_leaching',
  'corrosion_erosion',
  'other',
] as const
export type Mechanism = (typeof MECHANISMS)[number]
export const MECHANISM_LABELS: Record<Mechanism, string> = {
  ductile_overload: 'Ductile overload',
  brittle_fracture: 'Brittle fracture',
  fatigue_high_cycle: 'Fatigue — high-cycle',
  fatigue_low_cycle: 'Fatigue — low-cycle',
  fatigue_thermal: 'Fatigue — thermal',
  fatigue_corrosion: 'Fatigue — corrosion fatigue',
  fatigue_fretting: 'Fatigue — fretting',
  stress_corrosion_cracking: 'Stress-corrosion cracking',
  hydrogen_embrittlement: 'Hydrogen embrittlement',
  liquid_metal_embrittlement: 'Liquid-metal embrittlement',
  creep: 'Creep',
  wear: 'Wear',
  corrosion_uniform: 'Corrosion — uniform',
  corrosion_pitting: 'Corrosion — pitting',
  corrosion_crevice: 'Corrosion — crevice',
  corrosion_galvanic: 'Corrosion — galvanic',
  corrosion_intergranular: 'Corrosion — intergranular',
  corrosion_selective_leaching: 'Corrosion — selective leaching',
  corrosion_erosion: 'Corrosion — erosion-corrosion',
  other: 'Other',
}

export const ROOT_CAUSES = [
  'design',
  'material',
  'manufacturing',
  'assembly',
  'service',
  'maintenance',
  'environment',
  'undetermined',
] as const
export type RootCause = (typeof ROOT_CAUSES)[number]
export const ROOT_CAUSE_LABELS: Record<RootCause, string> = {
  design: 'Design',
  material: 'Material',
  manufacturing: 'Manufacturing or processing',
  assembly: 'Assembly or installation',
  service: 'Service or operation',
  maintenance: 'Maintenance',
  environment: 'Environment',
  undetermined: 'Undetermined',
}

export const PARTY_ROLES = [
  'owner',
  'operator',
  'manufacturer',
  'supplier',
  'insurer',
  'counsel',
  'regulator',
  'other',
] as const
export type PartyRole = (typeof PARTY_ROLES)[number]
export const PARTY_ROLE_LABELS: Record<PartyRole, string> = {
  owner: 'Owner',
  operator: 'Operator',
  manufacturer: 'Manufacturer',
  supplier: 'Supplier',
  insurer: 'Insurer',
  counsel: 'Counsel',
  regulator: 'Regulator',
  other: 'Other',
}

/** Names of the case record's fields as people read them (activity trail, messages). */
export const CASE_FIELD_LABELS: Record<string, string> = {
  title: 'Title',
  organisationId: 'Client organisation',
  contactName: 'Contact name',
  contactEmail: 'Contact e-mail',
  clientReference: 'Client reference',
  component: 'Component',
  partNumber: 'Part number',
  componentDescription: 'Description',
  componentFunction: 'Function in service',
  material: 'Material as specified',
  heatOrLot: 'Heat or lot',
  specificationId: 'Specification record',
  specificationBand: 'Size band',
  sectionSizeMm: 'Governing section size (mm)',
  receivedOn: 'Received on',
  failureDate: 'Failure date',
  failureLocation: 'Failure location',
  howFound: 'How it was found',
  scope: 'Scope of work',
  decisionRule: 'Decision rule',
  turnaround: 'Turnaround',
  safetyCritical: 'Safety-critical',
  dueDate: 'Due date',
  leadInvestigatorId: 'Lead investigator',
  coInvestigatorIds: 'Co-investigators',
  labTechnicianId: 'Lab technician',
  reviewerId: 'Reviewer',
  mechanisms: 'Failure mechanisms',
  rootCause: 'Root cause',
  interestedParties: 'Interested parties',
}
