import { createBrowserRouter, Navigate } from 'react-router';
import { routes } from '@/config/paths';
import { FieldSyncLayout } from './routes/field-sync';
import { NotFoundRoute } from './routes/not-found';
import { SessionLoading } from './routes/full-page-states';
import { ProtectedLayout } from './routes/protected-layout';
import { RequirePermission } from './routes/require-permission';
import { RootLayout } from './routes/root-layout';
import { RouteError } from './routes/route-error';

/**
 * The only place where features meet: each route composes what its page needs. A function, not a
 * module-level router, so that main.tsx decides when the first navigation starts (see app/start.tsx).
 */
export const createAppRouter = () => createBrowserRouter([
  {
    element: <RootLayout />,
    errorElement: <RouteError />,
    // Shown while the first page's code loads (only lazy pages make it wait).
    hydrateFallbackElement: <SessionLoading />,
    children: [
      // The signed-out pages load on demand: their forms (react-hook-form) stay out of the script a
      // signed-in technician's phone needs for its first page.
      { path: routes.signIn, lazy: async () => ({ Component: (await import('./routes/sign-in')).SignInRoute }) },
      { path: routes.forgotPassword, lazy: async () => ({ Component: (await import('./routes/forgot-password')).ForgotPasswordRoute }) },
      { path: routes.resetPassword, lazy: async () => ({ Component: (await import('./routes/reset-password')).ResetPasswordRoute }) },
      {
        element: <ProtectedLayout />,
        children: [
          {
            // Errors inside a page keep the navigation around them.
            errorElement: <RouteError />,
            // Sends the technician's queued checks from whichever page is open.
            element: <FieldSyncLayout />,
            children: [
              // "Today" loads on demand like the other pages (app/first-page.ts starts it early when it is
              // the first page), so the sign-in page and other roles' first pages do not run its code.
              { index: true, lazy: async () => ({ Component: (await import('./routes/home')).HomeRoute }) },
              {
                path: routes.people,
                // Admin-only pages load on demand, so a technician's phone never downloads them.
                lazy: async () => {
                  const { PeopleRoute } = await import('./routes/people');
                  return {
                    element: (
                      <RequirePermission action="users:manage" pageName="People">
                        <PeopleRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.outbox,
                lazy: async () => {
                  const { OutboxRoute } = await import('./routes/outbox');
                  return {
                    element: (
                      <RequirePermission action="mail:read" pageName="Outbox">
                        <OutboxRoute />
                      </RequirePermission>
                    ),
                  };
                },
                children: [
                  { index: true, lazy: async () => ({ Component: (await import('./routes/outbox')).OutboxIndexRoute }) },
                  { path: ':messageId', lazy: async () => ({ Component: (await import('./routes/outbox')).OutboxMessageRoute }) },
                ],
              },
              // Asset registry: lazy, so the technician's first page stays small; the string page carries the charts.
              {
                path: routes.sites,
                lazy: async () => {
                  const { SitesRoute } = await import('./routes/sites');
                  return {
                    element: (
                      <RequirePermission action="assets:read" pageName="Sites">
                        <SitesRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.site,
                lazy: async () => {
                  const { SiteRoute } = await import('./routes/site');
                  return {
                    element: (
                      <RequirePermission action="assets:read" pageName="Site">
                        <SiteRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.siteImport,
                lazy: async () => {
                  const { SiteImportRoute } = await import('./routes/site-import');
                  return {
                    element: (
                      <RequirePermission action="assets:write" pageName="Import layout">
                        <SiteImportRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.siteLabels,
                lazy: async () => {
                  const { SiteLabelsRoute } = await import('./routes/site-labels');
                  return {
                    element: (
                      <RequirePermission action="assets:read" pageName="QR labels">
                        <SiteLabelsRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.string,
                lazy: async () => {
                  const { StringRoute } = await import('./routes/string');
                  return {
                    element: (
                      <RequirePermission action="assets:read" pageName="String">
                        <StringRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              { path: routes.datasheets, element: <Navigate to={routes.moduleModels} replace /> },
              {
                path: routes.moduleModels,
                lazy: async () => {
                  const { ModuleModelsRoute } = await import('./routes/module-models');
                  return {
                    element: (
                      <RequirePermission action="assets:read" pageName="Module datasheets">
                        <ModuleModelsRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.inverterModels,
                lazy: async () => {
                  const { InverterModelsRoute } = await import('./routes/inverter-models');
                  return {
                    element: (
                      <RequirePermission action="assets:read" pageName="Inverter datasheets">
                        <InverterModelsRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.workOrders,
                lazy: async () => {
                  const { WorkOrdersRoute } = await import('./routes/work-orders');
                  return {
                    element: (
                      <RequirePermission action="workOrders:read" pageName="Work orders">
                        <WorkOrdersRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.newWorkOrder,
                lazy: async () => {
                  const { NewWorkOrderRoute } = await import('./routes/new-work-order');
                  return {
                    element: (
                      <RequirePermission action="workOrders:create" pageName="New work order">
                        <NewWorkOrderRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.workOrder,
                lazy: async () => {
                  const { WorkOrderRoute } = await import('./routes/work-order');
                  return {
                    element: (
                      <RequirePermission action="workOrders:read" pageName="Work order">
                        <WorkOrderRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.fieldChecks,
                lazy: async () => {
                  const { FieldChecksRoute } = await import('./routes/field-checks');
                  return {
                    element: (
                      <RequirePermission action="workOrders:read" pageName="Field checks">
                        <FieldChecksRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.instruments,
                lazy: async () => {
                  const { InstrumentsRoute } = await import('./routes/instruments');
                  return {
                    element: (
                      <RequirePermission action="instruments:manage" pageName="Instruments">
                        <InstrumentsRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              {
                path: routes.reports,
                lazy: async () => {
                  const { ReportsRoute } = await import('./routes/reports');
                  return {
                    element: (
                      <RequirePermission action="workOrders:read" pageName="Reports">
                        <ReportsRoute />
                      </RequirePermission>
                    ),
                  };
                },
              },
              // Fleet view: lazy, so no technician's phone downloads the map or the charts.
              {
                path: routes.fleet,
                lazy: async () => {
                  const { FleetRoute } = await import('./routes/fleet');
                  return { element: <RequirePermission action="fleet:read" pageName="Fleet"><FleetRoute /></RequirePermission> };
                },
              },
              {
                path: routes.fleetSite,
                lazy: async () => {
                  const { FleetSiteRoute } = await import('./routes/fleet-site');
                  return { element: <RequirePermission action="fleet:read" pageName="String health map"><FleetSiteRoute /></RequirePermission> };
                },
              },
              {
                path: routes.fleetMetrics,
                lazy: async () => {
                  const { FleetMetricsRoute } = await import('./routes/fleet-metrics');
                  return { element: <RequirePermission action="fleet:read" pageName="Fleet metrics"><FleetMetricsRoute /></RequirePermission> };
                },
              },
              {
                path: routes.fleetEnergy,
                lazy: async () => {
                  const { FleetEnergyRoute } = await import('./routes/fleet-energy');
                  return { element: <RequirePermission action="fleet:read" pageName="Energy at risk"><FleetEnergyRoute /></RequirePermission> };
                },
              },
              {
                path: routes.fleetExports,
                lazy: async () => {
                  const { FleetExportsRoute } = await import('./routes/fleet-exports');
                  return { element: <RequirePermission action="exports:read" pageName="Exports"><FleetExportsRoute /></RequirePermission> };
                },
              },
              { path: routes.settings, lazy: async () => ({ Component: (await import('./routes/settings')).SettingsRoute }) },
              { path: '*', element: <NotFoundRoute /> },
            ],
          },
        ],
      },
    ],
  },
]);
