import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { paths } from '../config/paths.ts';
import { authKeys } from '../features/auth/api/keys.ts';
import { RequireAuth } from '../features/auth/components/require-auth.tsx';
import { setUnauthorizedHandler } from '../lib/api-client.ts';
import { queryClient } from '../lib/query-client.ts';
import { AppLayout } from './layout/app-layout.tsx';
import { NotFoundPage } from './routes/errors/not-found.tsx';
import { RouteErrorPage } from './routes/errors/route-error.tsx';
import { HomePage } from './routes/home.tsx';
import { DeskLayout } from './routes/moderation/desk-nav.tsx';
import { SellerLayout } from './routes/seller/seller-nav.tsx';

/** The route tree, shared by the browser's router and the server render (src/app/ssr/entry-server.tsx). */
export const routes: RouteObject[] = [
  {
    element: <AppLayout />,
    errorElement: <RouteErrorPage />,
    children: [
      { path: paths.home.path, element: <HomePage /> },
      // The catalogue pages load on demand; the listing page pulls in the personaliser (and the font engine) only there.
      { path: paths.search.path, lazy: async () => ({ Component: (await import('./routes/catalog/search.tsx')).SearchPage }) },
      { path: paths.listing.path, lazy: async () => ({ Component: (await import('./routes/listing/listing.tsx')).ListingPage }) },
      { path: paths.shopPage.path, lazy: async () => ({ Component: (await import('./routes/shop-page/shop-page.tsx')).ShopPage }) },
      { path: paths.cart.path, lazy: async () => ({ Component: (await import('./routes/cart/cart.tsx')).CartPage }) },
      { path: paths.auth.signIn.path, lazy: async () => ({ Component: (await import('./routes/auth/sign-in.tsx')).SignInPage }) },
      { path: paths.auth.signUp.path, lazy: async () => ({ Component: (await import('./routes/auth/sign-up.tsx')).SignUpPage }) },
      { path: paths.auth.forgotPassword.path, lazy: async () => ({ Component: (await import('./routes/auth/forgot-password.tsx')).ForgotPasswordPage }) },
      { path: paths.auth.resetPassword.path, lazy: async () => ({ Component: (await import('./routes/auth/reset-password.tsx')).ResetPasswordPage }) },
      {
        element: <RequireAuth />,
        children: [
          { path: paths.orders.path, lazy: async () => ({ Component: (await import('./routes/orders/orders.tsx')).OrdersPage }) },
          { path: paths.orderDetail.path, lazy: async () => ({ Component: (await import('./routes/orders/order.tsx')).OrderPage }) },
          { path: paths.checkoutReturn.path, lazy: async () => ({ Component: (await import('./routes/checkout/return.tsx')).CheckoutReturnPage }) },
          { path: paths.openShop.path, lazy: async () => ({ Component: (await import('./routes/shop/open-shop.tsx')).OpenShopPage }) },
        ],
      },
      {
        element: <RequireAuth roles={['seller']} />,
        children: [
          // the press run fills the screen of a tablet beside the press: no site navigation
          { path: paths.workroomPressRun.path, lazy: async () => ({ Component: (await import('./routes/workroom/press-run.tsx')).PressRunPage }) },
          {
            // the seller's navigation stays above every seller page, also while one loads
            element: <SellerLayout />,
            children: [
              { path: paths.workroom.path, lazy: async () => ({ Component: (await import('./routes/workroom/workroom.tsx')).WorkroomPage }) },
              // the production pages (proofs, cut sheets, press cards, stock) load on demand
              { path: paths.workroomOrder.path, lazy: async () => ({ Component: (await import('./routes/workroom/order.tsx')).WorkroomOrderPage }) },
              { path: paths.workroomProof.path, lazy: async () => ({ Component: (await import('./routes/workroom/proof.tsx')).ProofPage }) },
              { path: paths.workroomCutSheets.path, lazy: async () => ({ Component: (await import('./routes/workroom/cut-sheets.tsx')).CutSheetsPage }) },
              { path: paths.workroomPress.path, lazy: async () => ({ Component: (await import('./routes/workroom/press.tsx')).PressPage }) },
              { path: paths.workroomStock.path, lazy: async () => ({ Component: (await import('./routes/workroom/stock.tsx')).StockPage }) },
              // seller pages load on demand (shop settings, materials, listings and the editor)
              { path: paths.seller.shop.path, lazy: async () => ({ Component: (await import('./routes/seller/shop-settings.tsx')).ShopSettingsPage }) },
              { path: paths.seller.offers.path, lazy: async () => ({ Component: (await import('./routes/seller/offers.tsx')).OffersPage }) },
              { path: paths.seller.materials.path, lazy: async () => ({ Component: (await import('./routes/seller/materials.tsx')).MaterialsPage }) },
              { path: paths.seller.blanks.path, lazy: async () => ({ Component: (await import('./routes/seller/blanks.tsx')).BlanksPage }) },
              { path: paths.seller.listings.path, lazy: async () => ({ Component: (await import('./routes/seller/listings.tsx')).SellerListingsPage }) },
              { path: paths.seller.newListing.path, lazy: async () => ({ Component: (await import('./routes/seller/listing-edit.tsx')).ListingEditPage }) },
              { path: paths.seller.editListing.path, lazy: async () => ({ Component: (await import('./routes/seller/listing-edit.tsx')).ListingEditPage }) },
              // the business view (charts pull in recharts) loads on demand
              { path: paths.business.overview.path, lazy: async () => ({ Component: (await import('./routes/business/overview.tsx')).BusinessOverviewPage }) },
              { path: paths.business.payouts.path, lazy: async () => ({ Component: (await import('./routes/business/payouts.tsx')).PayoutsPage }) },
              { path: paths.business.settings.path, lazy: async () => ({ Component: (await import('./routes/business/settings.tsx')).BusinessSettingsPage }) },
            ],
          },
        ],
      },
      {
        element: <RequireAuth roles={['admin']} />,
        children: [
          {
            element: <DeskLayout />,
            children: [
              { path: paths.moderation.desk.path, lazy: async () => ({ Component: (await import('./routes/moderation/desk.tsx')).ModerationDeskPage }) },
              { path: paths.moderation.reviewListing.path, lazy: async () => ({ Component: (await import('./routes/moderation/review-listing.tsx')).ReviewListingPage }) },
              { path: paths.moderation.audit.path, lazy: async () => ({ Component: (await import('./routes/moderation/audit.tsx')).AuditLogPage }) },
              { path: paths.moderation.mail.path, lazy: async () => ({ Component: (await import('./routes/moderation/mail.tsx')).MailPage }) },
            ],
          },
        ],
      },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
];

/** The browser's router (made in src/app/main.tsx, after the first page's lazy routes are loaded). */
export function createAppRouter() {
  const router = createBrowserRouter(routes);
  // A 401 from a non-auth call means the session ended: forget the account and ask to sign in,
  // coming back to this page afterwards.
  setUnauthorizedHandler(() => {
    const { pathname, search } = router.state.location;
    queryClient.setQueryData(authKeys.me(), null);
    if (pathname === paths.auth.signIn.path) return;
    void router.navigate(paths.auth.signIn.getHref(pathname + search), { replace: true });
  });
  return router;
}
