import { Role } from '@meritline/shared';
import { useState, type ComponentType } from 'react';
import { createBrowserRouter, type RouteObject } from 'react-router';
import { RouterProvider } from 'react-router/dom';
import { RouteErrorBoundary } from '@/components/error-boundary';
import { NotFound } from '@/components/not-found';
import { PageSpinner } from '@/components/page-spinner';
import { paths } from '@/lib/config/paths';
import { RequireRole } from './guards';

/** Each page is its own chunk, loaded when first visited. */
const page = (load: () => Promise<{ default: ComponentType }>) => async () => ({ Component: (await load()).default });

export const routes: RouteObject[] = [
  {
    path: '/',
    ErrorBoundary: RouteErrorBoundary,
    HydrateFallback: PageSpinner,
    children: [
      { path: paths.signIn.path, lazy: page(() => import('@/features/auth/routes/sign-in')) },
      { path: paths.acceptInvitation.path, lazy: page(() => import('@/features/auth/routes/accept-invitation')) },
      { path: paths.verify.path, lazy: page(() => import('@/features/reports/routes/verify-report')) },
      {
        // The shell loads with the first signed-in page: the sign-in page does not need it.
        lazy: page(() => import('./layout/protected-layout')),
        children: [
          { index: true, lazy: page(() => import('./routes/overview')) },
          { path: paths.changePassword.path, lazy: page(() => import('@/features/auth/routes/change-password')) },
          { path: paths.referenceMaterials.path, lazy: page(() => import('@/features/standards/routes/reference-materials')) },
          // Everyone may open it: analysts and reviewers see only the trail of the records they work on.
          { path: paths.auditTrail.path, lazy: page(() => import('@/features/audit/routes/audit-trail')) },
          {
            element: <RequireRole roles={[Role.Analyst]} />,
            children: [
              { path: paths.studyNew.path, lazy: page(() => import('@/features/studies/routes/new-study')) },
              { path: paths.studyEdit.path, lazy: page(() => import('./routes/study-wizard')) },
              { path: paths.runs.path, lazy: page(() => import('@/features/runs/routes/routine-batches')) },
              { path: paths.runNew.path, lazy: page(() => import('@/features/runs/routes/new-run')) },
              { path: paths.preparations.path, lazy: page(() => import('@/features/standards/routes/preparations')) },
              { path: paths.preparationNew.path, lazy: page(() => import('@/features/standards/routes/new-preparation')) },
            ],
          },
          {
            element: <RequireRole roles={[Role.Reviewer]} />,
            children: [{ path: paths.reviews.path, lazy: page(() => import('@/features/reviews/routes/review-queue')) }],
          },
          {
            element: <RequireRole roles={[Role.Analyst, Role.Reviewer, Role.QualityManager]} />,
            // Reviewers open runs from the review queue to release them.
            children: [
              { path: paths.runControlChart.path, lazy: page(() => import('@/features/runs/routes/control-chart')) },
              { path: paths.runDetail.path, lazy: page(() => import('@/features/runs/routes/run-detail')) },
            ],
          },
          {
            // Administrators open a study to give a draft to another analyst.
            element: <RequireRole roles={[Role.Analyst, Role.Reviewer, Role.QualityManager, Role.Admin]} />,
            children: [{ path: paths.studyView.path, lazy: page(() => import('@/features/reviews/routes/study-view')) }],
          },
          {
            // Administrators read the list to find a draft that must change hands.
            element: <RequireRole roles={[Role.Analyst, Role.Admin]} />,
            children: [{ path: paths.studies.path, lazy: page(() => import('@/features/studies/routes/studies')) }],
          },
          {
            // Analysts read methods and may propose drafts; quality managers and administrators decide.
            element: <RequireRole roles={[Role.Analyst, Role.QualityManager, Role.Admin]} />,
            children: [
              { path: paths.methods.path, lazy: page(() => import('@/features/methods/routes/methods')) },
              { path: paths.methodDetail.path, lazy: page(() => import('@/features/methods/routes/method-detail')) },
            ],
          },
          {
            element: <RequireRole roles={[Role.QualityManager]} />,
            children: [{ path: paths.methodComparison.path, lazy: page(() => import('@/features/methods/routes/version-comparison')) }],
          },
          {
            element: <RequireRole roles={[Role.QualityManager, Role.Admin]} />,
            children: [{ path: paths.qualification.path, lazy: page(() => import('@/features/qualification/routes/qualification')) }],
          },
          {
            element: <RequireRole roles={[Role.Admin]} />,
            children: [
              { path: paths.users.path, lazy: page(() => import('@/features/users/routes/users')) },
              {
                path: paths.outbox.path,
                lazy: page(() => import('@/features/outbox/routes/outbox')),
                children: [{ path: paths.outboxMessage.path }],
              },
            ],
          },
          { path: '*', Component: NotFound },
        ],
      },
    ],
  },
];

export function AppRouter() {
  const [router] = useState(() => createBrowserRouter(routes));
  return <RouterProvider router={router} />;
}
