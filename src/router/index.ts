import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import { STAFF_ROLES, type Role } from '../../shared/schemas/roles'
import { CASE_SECTIONS } from './case-sections'
import { installSessionGuard } from './session-guard'

declare module 'vue-router' {
  interface RouteMeta {
    /** Open to anyone, signed in or not. */
    public?: boolean
    /** Only people holding one of these roles may open the page; others see "Not found". */
    roles?: readonly Role[]
    /** Shown in the browser tab before the product's name. */
    title?: string
  }
}

const CASE_OPENERS: readonly Role[] = ['admin', 'investigator']
const ADMINS: readonly Role[] = ['admin']
const STAFF: readonly Role[] = STAFF_ROLES

export const router = createRouter({
  history: createWebHistory(),
  routes: [
    {
      path: '/',
      name: 'home',
      component: () => import('@/views/HomeView.vue'),
      meta: { title: 'Home' },
    },
    {
      path: '/sign-in',
      name: 'sign-in',
      component: () => import('@/views/SignInView.vue'),
      meta: { public: true, title: 'Sign in' },
    },
    {
      path: '/set-password',
      name: 'set-password',
      component: () => import('@/views/SetPasswordView.vue'),
      meta: { title: 'Set password' },
    },
    {
      path: '/settings/notices',
      name: 'notice-settings',
      component: () => import('@/views/NoticeSettingsView.vue'),
      meta: { title: 'E-mail notices' },
    },
    {
      path: '/second-factor',
      name: 'second-factor-setup',
      component: () => import('@/views/SecondFactorSetupView.vue'),
      meta: { title: 'Two-factor sign-in' },
    },
    {
      path: '/cases',
      name: 'cases',
      component: () => import('@/views/CaseListView.vue'),
      meta: { title: 'Cases' },
    },
    {
      path: '/cases/new',
      name: 'case-new',
      component: () => import('@/views/NewCaseView.vue'),
      meta: { roles: CASE_OPENERS, title: 'New case' },
    },
    {
      path: '/cases/:id(\\d+)',
      component: () => import('@/views/CaseLayoutView.vue'),
      props: (route) => ({ id: Number(route.params.id) }),
      meta: { title: 'Case' },
      children: CASE_SECTIONS.map((section): RouteRecordRaw => ({
        path: section.path,
        name: section.name,
        component: section.component,
        meta: { title: section.label, roles: section.roles },
        // a section with sub-sections opens its first one
        children: section.children ?? [],
        ...(section.children?.[0] ? { redirect: { name: section.children[0].name } } : {}),
      })),
    },
    {
      path: '/reports',
      name: 'reports',
      component: () => import('@/views/ReadingRoomView.vue'),
      meta: { title: 'Reports' },
    },
    {
      path: '/reports/:reportId(\\d+)',
      name: 'report',
      component: () => import('@/views/ReportReaderView.vue'),
      props: (route) => ({ reportId: Number(route.params.reportId) }),
      meta: { title: 'Report' },
    },
    {
      path: '/specifications',
      name: 'specifications',
      component: () => import('@/views/SpecificationLibraryView.vue'),
      meta: { roles: STAFF, title: 'Specification library' },
    },
    {
      path: '/specifications/new',
      name: 'specification-new',
      component: () => import('@/views/SpecificationRecordView.vue'),
      meta: { roles: ADMINS, title: 'New specification record' },
    },
    {
      path: '/specifications/:specId(\\d+)',
      name: 'specification',
      component: () => import('@/views/SpecificationRecordView.vue'),
      meta: { roles: STAFF, title: 'Specification record' },
    },
    {
      path: '/admin/people',
      name: 'people',
      component: () => import('@/views/PeopleView.vue'),
      meta: { roles: ADMINS, title: 'People' },
    },
    {
      path: '/admin/organisations',
      name: 'organisations',
      component: () => import('@/views/OrganisationsView.vue'),
      meta: { roles: ADMINS, title: 'Organisations' },
    },
    {
      path: '/admin/outbox',
      name: 'outbox',
      component: () => import('@/views/OutboxView.vue'),
      meta: { roles: ADMINS, title: 'Outbox' },
    },
    {
      path: '/admin/mail',
      name: 'mail-sent',
      component: () => import('@/views/MailSentView.vue'),
      meta: { roles: ADMINS, title: 'Mail sent' },
    },
    {
      path: '/admin/laboratory',
      name: 'laboratory',
      component: () => import('@/views/LaboratorySettingsView.vue'),
      meta: { roles: ADMINS, title: 'Laboratory' },
    },
    {
      path: '/admin/security-events',
      name: 'security-events',
      component: () => import('@/views/SecurityEventsView.vue'),
      meta: { roles: ADMINS, title: 'Security trail' },
    },
    {
      path: '/:pathMatch(.*)*',
      name: 'not-found',
      component: () => import('@/views/NotFoundView.vue'),
      meta: { public: true, title: 'Not found' },
    },
  ],
})

installSessionGuard(router)

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Fractolog` : 'Fractolog'
})
