import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { SiteLayout } from './layouts/site-layout.tsx';
import { StorefrontLayout } from './layouts/storefront-layout.tsx';
import { NotFoundPage } from './routes/not-found.tsx';
import { PageError, PageLoading, SectionError } from './routes/route-error.tsx';
import { StorefrontHomePage } from './routes/storefront/storefront-home.tsx';

/**
 * Platform pages, a studio's storefront (/s/…) and its workspace (/studio/…), each section a
 * layout route whose pages render in its outlet. The storefront home is in the first bundle;
 * every other page loads its own code when first opened, so a buyer never downloads the
 * workspace. A page that fails shows its error inside the section's frame; a frame that fails
 * shows the section's error.
 */
const page =
  <K extends string>(load: () => Promise<Record<K, React.ComponentType>>, name: K) =>
  async () => ({
    Component: (await load())[name],
  });

/** A section: its layout route, an error element for the frame and one for the pages inside it. */
const section = (path: string, frame: Pick<RouteObject, 'element' | 'lazy'>, pages: RouteObject[]): RouteObject => ({
  path,
  ...frame,
  errorElement: <SectionError />,
  HydrateFallback: PageLoading,
  children: [{ errorElement: <PageError />, children: pages }],
});

export const router = createBrowserRouter([
  section('/', { element: <SiteLayout /> }, [
    { index: true, lazy: page(() => import('./routes/home.tsx'), 'HomePage') },
    { path: 'sign-in', lazy: page(() => import('./routes/sign-in.tsx'), 'SignInPage') },
    { path: 'sign-in/link-sent', lazy: page(() => import('./routes/sign-in.tsx'), 'LinkSentPage') },
    { path: 'open-a-studio', lazy: page(() => import('./routes/open-a-studio.tsx'), 'OpenStudioPage') },
    { path: 'invites/:token', lazy: page(() => import('./routes/invite.tsx'), 'InvitePage') },
    { path: 'account/orders', lazy: page(() => import('./routes/my-orders.tsx'), 'MyOrdersPage') },
    { path: 'platform/studios', lazy: page(() => import('./routes/platform-studios.tsx'), 'PlatformStudiosPage') },
  ]),
  section('/s/:studioSlug', { element: <StorefrontLayout /> }, [
    { index: true, element: <StorefrontHomePage /> },
    { path: 'blanks/:blankId', lazy: page(() => import('./routes/storefront/blank-page.tsx'), 'BlankPage') },
    { path: 'cart', lazy: page(() => import('./routes/storefront/cart.tsx'), 'CartPage') },
    { path: 'orders/:orderId', lazy: page(() => import('./routes/storefront/order.tsx'), 'OrderPage') },
    { path: 'proofs/:token', lazy: page(() => import('./routes/storefront/proof.tsx'), 'ProofPage') },
    { path: 'replace/:token', lazy: page(() => import('./routes/storefront/replace-photo.tsx'), 'ReplacePhotoPage') },
  ]),
  // The workspace's frame loads with its first page: a buyer never needs it.
  section('/studio/:studioSlug', { lazy: page(() => import('./layouts/workspace-layout.tsx'), 'WorkspaceLayout') }, [
    { index: true, lazy: page(() => import('./routes/workspace/overview.tsx'), 'WorkspaceOverviewPage') },
    { path: 'team', lazy: page(() => import('./routes/workspace/team.tsx'), 'TeamPage') },
    { path: 'audit', lazy: page(() => import('./routes/workspace/audit.tsx'), 'AuditLogPage') },
    { path: 'settings', lazy: page(() => import('./routes/workspace/settings.tsx'), 'SettingsPage') },
    { path: 'orders', lazy: page(() => import('./routes/workspace/orders/orders.tsx'), 'OrdersPage') },
    { path: 'orders/:orderId', lazy: page(() => import('./routes/workspace/orders/order.tsx'), 'StaffOrderPage') },
    { path: 'items/:itemId', lazy: page(() => import('./routes/workspace/orders/item.tsx'), 'StaffItemPage') },
    { path: 'review', lazy: page(() => import('./routes/workspace/orders/review.tsx'), 'ReviewPage') },
    { path: 'production', lazy: page(() => import('./routes/workspace/production/production.tsx'), 'ProductionPage') },
    { path: 'production/batches/:batchId', lazy: page(() => import('./routes/workspace/production/batch.tsx'), 'BatchPage') },
    { path: 'catalog', element: <Navigate to="blanks" replace /> },
    { path: 'catalog/blanks', lazy: page(() => import('./routes/workspace/catalog/blanks.tsx'), 'BlanksPage') },
    { path: 'catalog/blanks/:blankId', lazy: page(() => import('./routes/workspace/catalog/blank.tsx'), 'BlankPage') },
    { path: 'catalog/materials', lazy: page(() => import('./routes/workspace/catalog/materials.tsx'), 'MaterialsPage') },
    { path: 'catalog/machines', lazy: page(() => import('./routes/workspace/catalog/machines.tsx'), 'MachinesPage') },
    { path: 'catalog/recipes', lazy: page(() => import('./routes/workspace/catalog/recipes.tsx'), 'RecipesPage') },
  ]),
  { path: '*', element: <NotFoundPage />, errorElement: <SectionError /> },
]);
