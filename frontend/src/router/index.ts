import { createRouter, createWebHistory, type RouteRecordRaw } from 'vue-router'
import { projectRoles } from '../api/types'
import { useAuthStore } from '../stores/auth'
import { decideAccess, type RouteRole } from './access'

declare module 'vue-router' {
  interface RouteMeta {
    /** Open without signing in. */
    public?: boolean
    /** Roles allowed in the route's project (global admins always pass). */
    roles?: readonly RouteRole[]
    title?: string
  }
}

const members = projectRoles

export const routes: RouteRecordRaw[] = [
  { path: '/', redirect: { name: 'projects' } },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('../views/SignInView.vue'),
    meta: { public: true, title: 'Sign in' },
  },
  {
    path: '/projects',
    name: 'projects',
    component: () => import('../views/ProjectsView.vue'),
    meta: { title: 'Projects' },
  },
  {
    path: '/projects/:projectId',
    name: 'project',
    component: () => import('../views/ProjectHomeView.vue'),
    props: true,
    meta: { roles: members, title: 'Project' },
  },
  {
    path: '/projects/:projectId/holes/:holeId',
    name: 'hole',
    component: () => import('../views/HoleView.vue'),
    props: true,
    meta: { roles: members, title: 'Hole' },
  },
  {
    path: '/projects/:projectId/audit',
    name: 'audit',
    component: () => import('../views/AuditView.vue'),
    props: true,
    meta: { roles: ['engineer', 'lead'], title: 'Audit trail' },
  },
  {
    path: '/projects/:projectId/holes/:holeId/depth',
    name: 'hole-depth',
    component: () => import('../views/DepthView.vue'),
    props: true,
    meta: { roles: members, title: 'Depth view' },
  },
  {
    path: '/projects/:projectId/holes/:holeId/intervals/:intervalId',
    name: 'interval',
    component: () => import('../views/IntervalView.vue'),
    props: true,
    meta: { roles: members, title: 'Interval' },
  },
  {
    path: '/projects/:projectId/packs',
    name: 'packs',
    component: () => import('../views/PacksView.vue'),
    props: true,
    meta: { roles: members, title: 'Design packs' },
  },
  {
    path: '/ags-check',
    name: 'ags-check',
    component: () => import('../views/AgsCheckView.vue'),
    meta: { title: 'AGS4 file check' },
  },
  {
    path: '/admin/users',
    name: 'admin-users',
    component: () => import('../views/AdminUsersView.vue'),
    meta: { roles: ['admin'], title: 'Users' },
  },
  {
    path: '/admin/mailbox',
    name: 'dev-mailbox',
    component: () => import('../views/DevMailboxView.vue'),
    meta: { roles: ['admin'], title: 'Dev mailbox' },
  },
  {
    path: '/invitations/accept',
    name: 'accept-invitation',
    component: () => import('../views/AcceptInvitationView.vue'),
    meta: { public: true, title: 'Join' },
  },
  {
    path: '/forgot-password',
    name: 'forgot-password',
    component: () => import('../views/ForgotPasswordView.vue'),
    meta: { public: true, title: 'Forgot password' },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: () => import('../views/ResetPasswordView.vue'),
    meta: { public: true, title: 'New password' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('../views/NotFoundView.vue'),
    meta: { title: 'Not found' },
  },
]

export const router = createRouter({
  history: createWebHistory(),
  routes,
  scrollBehavior: () => ({ top: 0 }),
})

router.beforeEach(async (to) => {
  const auth = useAuthStore()
  try {
    await auth.ensureLoaded()
  } catch {
    // Server unreachable: fall through as signed out; the sign-in page reports the failure.
  }
  return decideAccess(to, auth)
})

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Downdip` : 'Downdip'
})
