import { createBrowserRouter } from 'react-router-dom';
import { paths } from '../config/paths.ts';
import { RequireAuth } from '../features/auth/components/require-auth.tsx';
import { setUnauthorizedHandler } from '../lib/api-client.ts';
import { queryClient } from '../lib/query-client.ts';
import { authKeys } from '../features/auth/api/keys.ts';
import { AppLayout } from './layout/app-layout.tsx';
import { ForgotPasswordPage } from './routes/auth/forgot-password.tsx';
import { ResetPasswordPage } from './routes/auth/reset-password.tsx';
import { SignInPage } from './routes/auth/sign-in.tsx';
import { SignUpPage } from './routes/auth/sign-up.tsx';
import { CartPage } from './routes/cart/cart.tsx';
import { SearchPage } from './routes/catalog/search.tsx';
import { NotFoundPage } from './routes/errors/not-found.tsx';
import { RouteErrorPage } from './routes/errors/route-error.tsx';
import { HomePage } from './routes/home.tsx';
import { MailPage } from './routes/moderation/mail.tsx';
import { ModerationDeskPage } from './routes/moderation/desk.tsx';
import { OrdersPage } from './routes/orders/orders.tsx';
import { OpenShopPage } from './routes/shop/open-shop.tsx';
import { WorkroomPage } from './routes/workroom/workroom.tsx';

export const router = createBrowserRouter([
  {
    element: <AppLayout />,
    errorElement: <RouteErrorPage />,
    children: [
      { path: paths.home.path, element: <HomePage /> },
      { path: paths.search.path, element: <SearchPage /> },
      { path: paths.cart.path, element: <CartPage /> },
      { path: paths.auth.signIn.path, element: <SignInPage /> },
      { path: paths.auth.signUp.path, element: <SignUpPage /> },
      { path: paths.auth.forgotPassword.path, element: <ForgotPasswordPage /> },
      { path: paths.auth.resetPassword.path, element: <ResetPasswordPage /> },
      {
        element: <RequireAuth />,
        children: [
          { path: paths.orders.path, element: <OrdersPage /> },
          { path: paths.openShop.path, element: <OpenShopPage /> },
        ],
      },
      { element: <RequireAuth roles={['seller']} />, children: [{ path: paths.workroom.path, element: <WorkroomPage /> }] },
      {
        element: <RequireAuth roles={['admin']} />,
        children: [
          { path: paths.moderation.desk.path, element: <ModerationDeskPage /> },
          { path: paths.moderation.mail.path, element: <MailPage /> },
        ],
      },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);

// A 401 from a non-auth call means the session ended: forget the account and ask to sign in,
// coming back to this page afterwards.
setUnauthorizedHandler(() => {
  const { pathname, search } = router.state.location;
  queryClient.setQueryData(authKeys.me(), null);
  if (pathname === paths.auth.signIn.path) return;
  void router.navigate(paths.auth.signIn.getHref(pathname + search), { replace: true });
});
