import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect, useMemo } from 'react';
import { createBrowserRouter, redirect, RouterProvider, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import type { Role } from '@millrace/contracts';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { meQueryOptions } from '@/lib/auth';
import { rolesWith } from '@/lib/authorization';
import { onSessionLost } from '@/lib/session-events';
import { Loading } from '@/components/ui/loading';
import { RouteError } from './routes/route-error';

/** What a route module exports: the page, and optionally a loader factory fed the query client. */
type RouteModule = {
  default: React.ComponentType;
  clientLoader?: (queryClient: QueryClient) => (args: LoaderFunctionArgs) => unknown;
};

/** Roles allowed on a route, read by the app layout (the API enforces them again). */
export type RouteHandle = { roles: readonly Role[]; title: string };

const lazyRoute = (queryClient: QueryClient, load: () => Promise<RouteModule>) => async () => {
  const module = await load();
  return { Component: module.default, loader: module.clientLoader?.(queryClient) };
};

const allRoles: readonly Role[] = ['admin', 'planner', 'supervisor', 'floor_lead'];

/**
 * Every page of the planner. Each is its own lazily loaded module, so the sign-in page and the
 * shell download only what they need. Adding a feature: one entry here, one in navigation.ts.
 */
export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  const page = (path: string | undefined, roles: readonly Role[], title: string, load: () => Promise<RouteModule>): RouteObject =>
    path === undefined
      ? { index: true, handle: { roles, title } satisfies RouteHandle, lazy: lazyRoute(queryClient, load) }
      : { path, handle: { roles, title } satisfies RouteHandle, lazy: lazyRoute(queryClient, load) };

  const signedIn = async ({ request }: LoaderFunctionArgs) => {
    try {
      return await queryClient.ensureQueryData(meQueryOptions());
    } catch (error) {
      if (isApiError(error) && error.status === 401) {
        const url = new URL(request.url);
        throw redirect(paths.signIn.getHref(url.pathname + url.search));
      }
      throw error;
    }
  };

  return [
    {
      path: paths.signIn.path,
      errorElement: <RouteError />,
      hydrateFallbackElement: <Loading label="Opening Millrace…" />,
      lazy: lazyRoute(queryClient, () => import('./routes/sign-in')),
    },
    ...[
      { path: paths.welcome.path, load: () => import('./routes/welcome') },
      { path: paths.resetPassword.path, load: () => import('./routes/reset-password') },
      { path: paths.forgotPassword.path, load: () => import('./routes/forgot-password') },
    ].map(({ path, load }) => ({ path, errorElement: <RouteError />, hydrateFallbackElement: <Loading label="Opening Millrace…" />, lazy: lazyRoute(queryClient, load) })),
    {
      // Paper: no navigation around it. Signed in like every page (the loader below).
      path: paths.printShiftSheets.path,
      errorElement: <RouteError />,
      hydrateFallbackElement: <Loading label="Preparing the sheets…" />,
      loader: signedIn,
      lazy: lazyRoute(queryClient, () => import('./routes/print-shift-sheets')),
    },
    {
      path: paths.home.path,
      errorElement: <RouteError />,
      hydrateFallbackElement: <Loading label="Opening Millrace…" />,
      loader: async ({ request }) => {
        try {
          return await queryClient.ensureQueryData(meQueryOptions());
        } catch (error) {
          if (isApiError(error) && error.status === 401) {
            const url = new URL(request.url);
            throw redirect(paths.signIn.getHref(url.pathname + url.search));
          }
          throw error;
        }
      },
      lazy: lazyRoute(queryClient, () => import('./routes/app/layout')),
      children: [
        page(undefined, allRoles, 'Home', () => import('./routes/app/home')),
        page(paths.products.path, rolesWith('read:master-data'), 'Products', () => import('./routes/app/products')),
        page(paths.productNew.path, rolesWith('write:master-data'), 'New product', () => import('./routes/app/product-new')),
        page(paths.product.path, rolesWith('read:master-data'), 'Product', () => import('./routes/app/product')),
        page(paths.workCenters.path, rolesWith('read:master-data'), 'Work centers', () => import('./routes/app/work-centers')),
        page(paths.workCenterNew.path, rolesWith('write:master-data'), 'New work center', () => import('./routes/app/work-center-new')),
        page(paths.workCenter.path, rolesWith('read:master-data'), 'Work center', () => import('./routes/app/work-center')),
        page(paths.materials.path, rolesWith('read:master-data'), 'Materials', () => import('./routes/app/materials')),
        page(paths.materialNew.path, rolesWith('write:master-data'), 'New material', () => import('./routes/app/material-new')),
        page(paths.material.path, rolesWith('read:master-data'), 'Material', () => import('./routes/app/material')),
        page(paths.demand.path, rolesWith('read:demand'), 'Demand', () => import('./routes/app/demand')),
        page(paths.settings.path, rolesWith('read:settings'), 'Plant settings', () => import('./routes/app/settings')),
        page(paths.people.path, rolesWith('manage:people'), 'People', () => import('./routes/app/people')),
        page(paths.mail.path, rolesWith('read:outbox'), 'Outgoing mail', () => import('./routes/app/mail')),
        page(paths.caughtMail.path, rolesWith('read:caught-mail'), 'Caught mail', () => import('./routes/app/caught-mail')),
        page(paths.changePassword.path, allRoles, 'Change password', () => import('./routes/app/change-password')),
        page(paths.imports.path, rolesWith('write:master-data'), 'Imports', () => import('./routes/app/imports')),
        page(paths.plans.path, rolesWith('read:plans'), 'Plan versions', () => import('./routes/app/plans')),
        page(paths.planNew.path, rolesWith('write:plans'), 'New plan version', () => import('./routes/app/plan-new')),
        page(paths.planCompare.path, rolesWith('read:plans'), 'Compare plan versions', () => import('./routes/app/plan-compare')),
        page(paths.plan.path, rolesWith('read:plans'), 'Plan version', () => import('./routes/app/plan')),
        page(paths.planResults.path, rolesWith('read:plans'), 'Plan results', () => import('./routes/app/plan-results')),
        page(paths.planReview.path, rolesWith('read:plans'), 'Plan review', () => import('./routes/app/plan-review')),
        page(paths.scenarios.path, rolesWith('read:plans'), 'Scenarios', () => import('./routes/app/scenarios')),
        page(paths.scenarioNew.path, rolesWith('write:plans'), 'New scenario', () => import('./routes/app/scenario-new')),
        page(paths.scenario.path, rolesWith('read:plans'), 'Scenario', () => import('./routes/app/scenario')),
        page(paths.shiftSheets.path, rolesWith('read:shift-sheets'), 'Shift sheets', () => import('./routes/app/shift-sheets')),
        page('*', allRoles, 'Not found', () => import('./routes/app/not-found')),
      ],
    },
  ];
}

type RouterFactory = (routes: RouteObject[]) => ReturnType<typeof createBrowserRouter>;

/** The router, and the rule that any 401 ends the session in the UI too. */
export function AppRouter({ createRouter = createBrowserRouter }: { createRouter?: RouterFactory }) {
  const queryClient = useQueryClient();
  const router = useMemo(() => createRouter(createAppRoutes(queryClient)), [queryClient, createRouter]);

  useEffect(
    () =>
      onSessionLost(() => {
        queryClient.clear();
        const { pathname, search } = router.state.location;
        if (pathname !== paths.signIn.path) void router.navigate(paths.signIn.getHref(pathname + search), { replace: true });
      }),
    [queryClient, router],
  );

  return <RouterProvider router={router} />;
}
