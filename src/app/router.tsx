import { lazy, Suspense, type ReactNode } from 'react';
import { createBrowserRouter, RouterProvider, type LoaderFunctionArgs } from 'react-router-dom';
import { LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { getMeQueryOptions } from '@/features/auth/api/get-me';
import { queryClient } from '@/lib/query-client';
import { RequirePermission, SignedInLayout } from './guards';

const SignInRoute = lazy(() => import('./routes/sign-in'));
const OverviewRoute = lazy(() => import('./routes/overview'));
const ReviewRoute = lazy(() => import('./routes/review'));
const VariantRoute = lazy(() => import('./routes/variant'));
const RegisterVariantRoute = lazy(() => import('./routes/register-variant'));
const EnzymesRoute = lazy(() => import('./routes/enzymes'));
const NewEnzymeRoute = lazy(() => import('./routes/new-enzyme'));
const EnzymeRoute = lazy(() => import('./routes/enzyme'));
const CampaignRoute = lazy(() => import('./routes/campaign'));
const NewCampaignRoute = lazy(() => import('./routes/new-campaign'));
const AssayEntryRoute = lazy(() => import('./routes/assay-entry'));
const PhProfileEntryRoute = lazy(() => import('./routes/ph-profile-entry'));
const LandscapeRoute = lazy(() => import('./routes/landscape'));
const ImportsRoute = lazy(() => import('./routes/imports'));
const AboutRoute = lazy(() => import('./routes/about'));
const ChangePasswordRoute = lazy(() => import('./routes/change-password'));
const AdminUsersRoute = lazy(() => import('./routes/admin-users'));
const NotFoundRoute = lazy(() => import('./routes/not-found'));
const DigestsRoute = lazy(() => import('./routes/digests'));
const OutboxRoute = lazy(() => import('./routes/outbox'));
const AcceptInvitationRoute = lazy(() => import('./routes/accept-invitation'));
const ForgotPasswordRoute = lazy(() => import('./routes/forgot-password'));
const ResetPasswordRoute = lazy(() => import('./routes/reset-password'));
const UnsubscribeRoute = lazy(() => import('./routes/unsubscribe'));

const page = (element: ReactNode) => <Suspense fallback={<LoadingState />}>{element}</Suspense>;

// The loaders start requests and return at once, so nothing waits on them: the session is asked for when
// the navigation starts, before page code loading in the meantime can hold up the first render that would
// otherwise ask for it; the registry's first rows are asked for alongside its code, rather than once the
// page has rendered. A failure here is met again, and shown, by the page.
function sessionLoader() {
  void queryClient.prefetchQuery(getMeQueryOptions());
  return null;
}

function registryLoader({ request }: LoaderFunctionArgs) {
  import('@/features/registry/api/prefetch-registry')
    .then(({ prefetchRegistry }) => void prefetchRegistry(queryClient, new URL(request.url).searchParams))
    .catch(() => undefined);
  return null;
}

// The registry's page comes through the router's own `lazy` rather than React.lazy: the router loads it
// before rendering, while React holds back content that follows a Suspense fallback for up to 300 ms.
const registryPage = () => import('./routes/registry').then((module) => ({ Component: module.default }));

const router = createBrowserRouter([
  { path: paths.signIn.path, element: page(<SignInRoute />) },
  { path: paths.acceptInvitation.path, element: page(<AcceptInvitationRoute />) },
  { path: paths.forgotPassword.path, element: page(<ForgotPasswordRoute />) },
  { path: paths.resetPassword.path, element: page(<ResetPasswordRoute />) },
  { path: paths.unsubscribe.path, element: page(<UnsubscribeRoute />) },
  {
    element: <SignedInLayout />,
    loader: sessionLoader,
    hydrateFallbackElement: <LoadingState label="Checking your session…" />,
    children: [
      { path: paths.home.path, element: page(<OverviewRoute />) },
      { path: paths.registry.path, lazy: registryPage, loader: registryLoader, hydrateFallbackElement: <LoadingState /> },
      {
        path: paths.review.path,
        element: page(
          <RequirePermission action="measurements:review">
            <ReviewRoute />
          </RequirePermission>,
        ),
      },
      { path: paths.variant.path, element: page(<VariantRoute />) },
      {
        path: paths.registerVariant.path,
        element: page(
          <RequirePermission action="variants:write">
            <RegisterVariantRoute />
          </RequirePermission>,
        ),
      },
      { path: paths.enzymes.path, element: page(<EnzymesRoute />) },
      {
        path: paths.newEnzyme.path,
        element: page(
          <RequirePermission action="variants:write">
            <NewEnzymeRoute />
          </RequirePermission>,
        ),
      },
      { path: paths.enzyme.path, element: page(<EnzymeRoute />) },
      { path: paths.campaign.path, element: page(<CampaignRoute />) },
      {
        path: paths.newCampaign.path,
        element: page(
          <RequirePermission action="campaigns:manage">
            <NewCampaignRoute />
          </RequirePermission>,
        ),
      },
      { path: paths.landscape.path, element: page(<LandscapeRoute />) },
      ...[paths.imports.path, paths.importJob.path].map((path) => ({
        path,
        element: page(
          <RequirePermission action="imports:write">
            <ImportsRoute />
          </RequirePermission>,
        ),
      })),
      {
        path: paths.assayEntry.path,
        element: page(
          <RequirePermission action="measurements:write">
            <AssayEntryRoute />
          </RequirePermission>,
        ),
      },
      {
        path: paths.phProfileEntry.path,
        element: page(
          <RequirePermission action="measurements:write">
            <PhProfileEntryRoute />
          </RequirePermission>,
        ),
      },
      { path: paths.about.path, element: page(<AboutRoute />) },
      { path: paths.changePassword.path, element: page(<ChangePasswordRoute />) },
      { path: paths.digests.path, element: page(<DigestsRoute />) },
      {
        path: paths.outbox.path,
        element: page(
          <RequirePermission action="users:manage">
            <OutboxRoute />
          </RequirePermission>,
        ),
      },
      {
        path: paths.adminUsers.path,
        element: page(
          <RequirePermission action="users:manage">
            <AdminUsersRoute />
          </RequirePermission>,
        ),
      },
      { path: '*', element: page(<NotFoundRoute />) },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
