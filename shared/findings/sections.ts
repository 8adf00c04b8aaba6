/** The usual sections of a failure-analysis report, in the order a draft starts with. */
export const SECTION_KEYS = [
  'summary',
  'background',
  'items',
  'examinations',
  'visual',
  'fractography',
  'metallography',
  'chemical',
  'mechanical',
  'discussion',
  'conclusions',
  'recommendations',
  'references',
] as const
export type SectionKey = (typeof SECTION_KEYS)[number]

export const SECTION_TITLES: Record<SectionKey, string> = {
  summary: 'Summary',
  background: 'Background and service history',
  items: 'Items received',
  examinations: 'Examinations',
  visual: 'Visual examination',
  fractography: 'Fractography',
  metallography: 'Metallography',
  chemical: 'Chemical analysis',
  mechanical: 'Mechanical testing',
  discussion: 'Discussion',
  conclusions: 'Conclusions',
  recommendations: 'Recommendations',
  references: 'References',
}

/** Sub-sections sit one heading level below the section they belong to. */
const SUBSECTIONS: readonly SectionKey[] = ['visual', 'fractography', 'metallography', 'chemical']
export const headingLevelOf = (key: SectionKey) => (SUBSECTIONS.includes(key) ? 3 : 2)

/** Where opinions belong: the reasoning and what follows from it, kept apart from the facts. */
export const OPINION_SECTIONS: readonly SectionKey[] = [
  'discussion',
  'conclusions',
  'recommendations',
]

export const isSectionKey = (value: unknown): value is SectionKey =>
  typeof value === 'string' && (SECTION_KEYS as readonly string[]).includes(value)
