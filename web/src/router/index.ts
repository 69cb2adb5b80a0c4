import {
  createRouter,
  createWebHistory,
  type RouteLocationNormalized,
  type RouteLocationRaw,
  type RouteRecordRaw,
  type Router,
  type RouterHistory,
} from 'vue-router';
import { setUnauthorizedHandler } from '@/api/client';
import { prefetchDesign } from '@/api/prefetch';
import { preloadStep } from '@/designSteps';
import { useAuthStore } from '@/stores/auth';
import type { Action } from '@/policy';

declare module 'vue-router' {
  interface RouteMeta {
    /** Only for signed-in people. */
    requiresAuth?: boolean;
    /** Only for people who are signed out (sign-in, sign-up…). */
    guestOnly?: boolean;
    /** The policy action the route needs, as the server checks it. */
    can?: Action;
    /** Which frame the view sits in. */
    layout?: 'app' | 'plain';
    title?: string;
  }
}

export const routes: RouteRecordRaw[] = [
  { path: '/', redirect: { name: 'projects' } },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('@/views/SignInView.vue'),
    meta: { guestOnly: true, layout: 'plain', title: 'Sign in' },
  },
  {
    path: '/sign-up',
    name: 'sign-up',
    component: () => import('@/views/SignUpView.vue'),
    meta: { guestOnly: true, layout: 'plain', title: 'Create a firm account' },
  },
  {
    path: '/confirm-sign-up',
    name: 'confirm-sign-up',
    component: () => import('@/views/ConfirmSignUpView.vue'),
    meta: { layout: 'plain', title: 'Finish creating your account' },
  },
  {
    path: '/forgot-password',
    name: 'forgot-password',
    component: () => import('@/views/ForgotPasswordView.vue'),
    meta: { guestOnly: true, layout: 'plain', title: 'Forgot password' },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: () => import('@/views/ResetPasswordView.vue'),
    meta: { layout: 'plain', title: 'Choose a new password' },
  },
  {
    path: '/accept-invitation',
    name: 'accept-invitation',
    component: () => import('@/views/AcceptInvitationView.vue'),
    meta: { layout: 'plain', title: 'Join your team' },
  },
  {
    path: '/projects',
    name: 'projects',
    component: () => import('@/views/ProjectListView.vue'),
    meta: { requiresAuth: true, can: 'projects.read', title: 'Projects' },
  },
  {
    path: '/projects/new',
    name: 'project-new',
    component: () => import('@/views/ProjectFormView.vue'),
    meta: { requiresAuth: true, can: 'projects.create', title: 'New project' },
  },
  {
    path: '/projects/:id',
    name: 'project',
    component: () => import('@/views/ProjectDetailView.vue'),
    props: true,
    meta: { requiresAuth: true, can: 'projects.read', title: 'Project' },
  },
  {
    path: '/projects/:id/design',
    name: 'project-design',
    component: () => import('@/views/DesignWorkspaceView.vue'),
    props: true,
    // Everyone signed in reads a design; the view shows it read-only to those who cannot edit.
    meta: { requiresAuth: true, can: 'projects.read', title: 'Design' },
    // After the guard (signed in, allowed): ask for the project and its design, and start the
    // opened step's code, while the workspace's code loads (api/prefetch.ts, designSteps.ts).
    beforeEnter: (to) => {
      prefetchDesign(String(to.params.id));
      preloadStep(to.query.step);
    },
  },
  {
    path: '/tools/jump-position',
    name: 'jump-position',
    component: () => import('@/views/JumpPositionView.vue'),
    // A calculator: it reads and stores nothing, so every signed-in role may use it.
    meta: { requiresAuth: true, title: 'Where the jump forms' },
  },
  {
    path: '/price-books',
    name: 'price-books',
    component: () => import('@/views/PriceBooksView.vue'),
    meta: { requiresAuth: true, can: 'priceBooks.list', title: 'Price books' },
  },
  {
    path: '/team',
    name: 'team',
    component: () => import('@/views/TeamView.vue'),
    meta: { requiresAuth: true, can: 'members.list', title: 'Team' },
  },
  {
    path: '/firm/brand',
    name: 'brand',
    component: () => import('@/views/BrandView.vue'),
    meta: { requiresAuth: true, can: 'brand.read', title: 'Firm brand' },
  },
  {
    path: '/billing',
    name: 'billing',
    component: () => import('@/views/BillingView.vue'),
    meta: { requiresAuth: true, can: 'billing.read', title: 'Billing' },
  },
  {
    path: '/account',
    name: 'account',
    component: () => import('@/views/AccountView.vue'),
    meta: { requiresAuth: true, title: 'Account' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/views/NotFoundView.vue'),
    meta: { layout: 'plain', title: 'Page not found' },
  },
];

/** Where a sign-in page should send someone afterwards: only paths inside the app. */
export function safeRedirect(value: unknown): string {
  return typeof value === 'string' && value.startsWith('/') && !value.startsWith('//')
    ? value
    : '/projects';
}

/** The navigation guard: sign-in, guest-only and role checks live here, not in views. */
export async function guard(to: RouteLocationNormalized): Promise<true | RouteLocationRaw> {
  const auth = useAuthStore();
  if (auth.isSignedIn && !auth.isLoaded) {
    try {
      await auth.ensureLoaded();
    } catch {
      // 401 already cleared the session; another failure (server down) keeps the token
      // and lets the page show its own error.
    }
  }
  if (to.meta.requiresAuth && !auth.isSignedIn) {
    return { name: 'sign-in', query: { redirect: to.fullPath } };
  }
  if (to.meta.guestOnly && auth.isSignedIn) {
    return { path: safeRedirect(to.query.redirect) };
  }
  if (to.meta.can && auth.isLoaded && !auth.can(to.meta.can)) {
    return { name: 'projects' };
  }
  return true;
}

/** The signed-in frame's chunk (AppShell: menu, user menu), kept off the sign-in path. */
export const loadAppShell = () => import('@/components/AppShell.vue');

export function createAppRouter(history: RouterHistory = createWebHistory()): Router {
  const router = createRouter({
    history,
    routes,
    scrollBehavior: () => ({ top: 0 }),
  });
  // Someone signed in going to a page in the frame: fetch the frame now, beside the view's own
  // chunk, not after it (App.vue waits for it). Signed out, the guard sends them to sign in.
  router.beforeEach((to) => {
    if (to.meta.layout !== 'plain' && useAuthStore().isSignedIn) void loadAppShell();
  });
  router.beforeEach(guard);
  router.afterEach((to) => {
    document.title = to.meta.title ? `${to.meta.title} · Basinwright` : 'Basinwright';
  });
  return router;
}

/** The central 401 handler: the session has ended, so clear it and ask to sign in again. */
export function installUnauthorizedHandler(router: Router): void {
  setUnauthorizedHandler(() => {
    const auth = useAuthStore();
    auth.clearSession();
    const current = router.currentRoute.value;
    if (current.meta.requiresAuth) {
      void router.replace({ name: 'sign-in', query: { redirect: current.fullPath } });
    }
  });
}
