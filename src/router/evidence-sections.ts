import type { RouteComponent } from 'vue-router'

export interface EvidenceSection {
  name: string
  /** path under /cases/:id/evidence */
  path: string
  label: string
  component: () => Promise<RouteComponent>
}

/** The sub-navigation of the Evidence section, in the order of the work. */
export const EVIDENCE_SECTIONS: EvidenceSection[] = [
  {
    name: 'case-evidence-samples',
    path: 'samples',
    label: 'Samples',
    component: () => import('@/views/case/evidence/EvidenceSamplesView.vue'),
  },
  {
    name: 'case-evidence-notices',
    path: 'notices',
    label: 'Notices',
    component: () => import('@/views/case/evidence/EvidenceNoticesView.vue'),
  },
  {
    name: 'case-photos',
    path: 'photos',
    label: 'Photographs',
    component: () => import('@/views/case/CasePhotosView.vue'),
  },
  {
    name: 'case-evidence-observations',
    path: 'observations',
    label: 'Observations',
    component: () => import('@/views/case/evidence/EvidenceObservationsView.vue'),
  },
]

/** Pages under evidence/ reached from the sub-sections rather than from the sub-navigation. */
export const EVIDENCE_PAGES: EvidenceSection[] = [
  {
    name: 'case-evidence-sample',
    path: 'samples/:sampleId(\\d+)',
    label: 'Item',
    component: () => import('@/views/case/evidence/EvidenceSampleView.vue'),
  },
  {
    name: 'case-evidence-labels',
    path: 'labels',
    label: 'Labels',
    component: () => import('@/views/case/evidence/EvidenceLabelsView.vue'),
  },
]
