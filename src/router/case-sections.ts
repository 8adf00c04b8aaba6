import type { RouteComponent, RouteRecordRaw } from 'vue-router'
import type { Role } from '../../shared/schemas/roles'
import { EVIDENCE_PAGES, EVIDENCE_SECTIONS } from './evidence-sections'

const STAFF: readonly Role[] = ['admin', 'investigator', 'lab', 'reviewer']

export interface CaseSection {
  name: string
  /** path under /cases/:id */
  path: string
  label: string
  /** only people holding one of these roles see the section */
  roles?: readonly Role[]
  component: () => Promise<RouteComponent>
  /** a section with sub-sections opens its first one */
  children?: RouteRecordRaw[]
}

const evidenceChildren: RouteRecordRaw[] = [...EVIDENCE_SECTIONS, ...EVIDENCE_PAGES].map(
  (page) => ({
    name: page.name,
    path: page.path,
    component: page.component,
    meta: { title: page.label, roles: STAFF },
  }),
)

/** The sections of the case workspace, in the order of the work. */
export const CASE_SECTIONS: readonly CaseSection[] = [
  {
    name: 'case',
    path: '',
    label: 'Overview',
    component: () => import('@/views/case/CaseOverviewView.vue'),
  },
  {
    name: 'case-service-history',
    path: 'service-history',
    label: 'Service history',
    component: () => import('@/views/case/CaseServiceHistoryView.vue'),
  },
  {
    name: 'case-evidence',
    path: 'evidence',
    label: 'Evidence',
    roles: STAFF,
    component: () => import('@/views/case/CaseEvidenceView.vue'),
    children: evidenceChildren,
  },
  {
    name: 'case-mechanical-tests',
    path: 'mechanical-tests',
    label: 'Mechanical tests',
    roles: STAFF,
    component: () => import('@/views/case/CaseMechanicalTestsView.vue'),
  },
  {
    name: 'case-findings',
    path: 'findings',
    label: 'Findings',
    roles: STAFF,
    component: () => import('@/views/case/CaseFindingsView.vue'),
  },
  {
    name: 'case-review',
    path: 'review',
    label: 'Review',
    roles: STAFF,
    component: () => import('@/views/case/CaseReviewView.vue'),
  },
  {
    name: 'case-reports',
    path: 'reports',
    label: 'Reports',
    roles: STAFF,
    component: () => import('@/views/case/CaseReportsView.vue'),
  },
  {
    name: 'case-activity',
    path: 'activity',
    label: 'Activity',
    roles: STAFF,
    component: () => import('@/views/case/CaseActivityView.vue'),
  },
]
