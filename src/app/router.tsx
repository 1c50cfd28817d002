import { lazy, Suspense, type ReactNode } from 'react';
import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { RequirePermission, SignedInLayout } from './guards';

const SignInRoute = lazy(() => import('./routes/sign-in'));
const AboutRoute = lazy(() => import('./routes/about'));
const ChangePasswordRoute = lazy(() => import('./routes/change-password'));
const AdminUsersRoute = lazy(() => import('./routes/admin-users'));
const NotFoundRoute = lazy(() => import('./routes/not-found'));

const page = (element: ReactNode) => <Suspense fallback={<LoadingState />}>{element}</Suspense>;

const router = createBrowserRouter([
  { path: paths.signIn.path, element: page(<SignInRoute />) },
  {
    element: <SignedInLayout />,
    children: [
      { path: paths.home.path, element: <Navigate to={paths.about.href()} replace /> },
      { path: paths.about.path, element: page(<AboutRoute />) },
      { path: paths.changePassword.path, element: page(<ChangePasswordRoute />) },
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
