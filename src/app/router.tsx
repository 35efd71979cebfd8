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
    { path: 'sign-in', lazy: page(() => import('./routes/sign-in.tsx'), 'SignInPage'), handle: { title: 'Sign in' } },
    { path: 'sign-in/link-sent', lazy: page(() => import('./routes/sign-in.tsx'), 'LinkSentPage'), handle: { title: 'Check your e-mail' } },
    { path: 'open-a-studio', lazy: page(() => import('./routes/open-a-studio.tsx'), 'OpenStudioPage'), handle: { title: 'Open a studio' } },
    { path: 'invites/:token', lazy: page(() => import('./routes/invite.tsx'), 'InvitePage'), handle: { title: 'Join a studio' } },
    { path: 'account/orders', lazy: page(() => import('./routes/my-orders.tsx'), 'MyOrdersPage'), handle: { title: 'My orders' } },
    {
      path: 'platform/studios',
      lazy: page(() => import('./routes/platform-studios.tsx'), 'PlatformStudiosPage'),
      handle: { title: 'Studios' },
    },
  ]),
  section('/s/:studioSlug', { element: <StorefrontLayout /> }, [
    { index: true, element: <StorefrontHomePage /> },
    {
      path: 'blanks/:blankId',
      lazy: page(() => import('./routes/storefront/blank-page.tsx'), 'BlankPage'),
      handle: { title: 'Design your piece' },
    },
    { path: 'cart', lazy: page(() => import('./routes/storefront/cart.tsx'), 'CartPage'), handle: { title: 'Cart' } },
    { path: 'orders/:orderId', lazy: page(() => import('./routes/storefront/order.tsx'), 'OrderPage'), handle: { title: 'Your order' } },
    { path: 'proofs/:token', lazy: page(() => import('./routes/storefront/proof.tsx'), 'ProofPage'), handle: { title: 'Your proof' } },
    {
      path: 'replace/:token',
      lazy: page(() => import('./routes/storefront/replace-photo.tsx'), 'ReplacePhotoPage'),
      handle: { title: 'A new photo' },
    },
  ]),
  // The workspace's frame loads with its first page: a buyer never needs it.
  section('/studio/:studioSlug', { lazy: page(() => import('./layouts/workspace-layout.tsx'), 'WorkspaceLayout') }, [
    { index: true, lazy: page(() => import('./routes/workspace/overview.tsx'), 'WorkspaceOverviewPage'), handle: { title: 'Overview' } },
    { path: 'team', lazy: page(() => import('./routes/workspace/team.tsx'), 'TeamPage'), handle: { title: 'Team' } },
    { path: 'audit', lazy: page(() => import('./routes/workspace/audit.tsx'), 'AuditLogPage'), handle: { title: 'Audit log' } },
    { path: 'settings', lazy: page(() => import('./routes/workspace/settings.tsx'), 'SettingsPage'), handle: { title: 'Settings' } },
    { path: 'orders', lazy: page(() => import('./routes/workspace/orders/orders.tsx'), 'OrdersPage'), handle: { title: 'Orders' } },
    {
      path: 'orders/:orderId',
      lazy: page(() => import('./routes/workspace/orders/order.tsx'), 'StaffOrderPage'),
      handle: { title: 'Order' },
    },
    {
      path: 'items/:itemId',
      lazy: page(() => import('./routes/workspace/orders/item.tsx'), 'StaffItemPage'),
      handle: { title: 'Prepare an item' },
    },
    { path: 'review', lazy: page(() => import('./routes/workspace/orders/review.tsx'), 'ReviewPage'), handle: { title: 'Photo review' } },
    { path: 'prep', lazy: page(() => import('./routes/workspace/orders/prep.tsx'), 'PrepQueuePage'), handle: { title: 'Prep' } },
    {
      path: 'production',
      lazy: page(() => import('./routes/workspace/production/production.tsx'), 'ProductionPage'),
      handle: { title: 'Production' },
    },
    {
      path: 'production/batches/:batchId',
      lazy: page(() => import('./routes/workspace/production/batch.tsx'), 'BatchPage'),
      handle: { title: 'Batch' },
    },
    { path: 'catalog', element: <Navigate to="blanks" replace /> },
    {
      path: 'catalog/blanks',
      lazy: page(() => import('./routes/workspace/catalog/blanks.tsx'), 'BlanksPage'),
      handle: { title: 'Blanks' },
    },
    {
      path: 'catalog/blanks/:blankId',
      lazy: page(() => import('./routes/workspace/catalog/blank.tsx'), 'BlankPage'),
      handle: { title: 'Blank' },
    },
    {
      path: 'catalog/materials',
      lazy: page(() => import('./routes/workspace/catalog/materials.tsx'), 'MaterialsPage'),
      handle: { title: 'Materials' },
    },
    {
      path: 'catalog/machines',
      lazy: page(() => import('./routes/workspace/catalog/machines.tsx'), 'MachinesPage'),
      handle: { title: 'Machines' },
    },
    {
      path: 'catalog/recipes',
      lazy: page(() => import('./routes/workspace/catalog/recipes.tsx'), 'RecipesPage'),
      handle: { title: 'Recipes' },
    },
  ]),
  { path: '*', element: <NotFoundPage />, errorElement: <SectionError />, handle: { title: 'Not found' } },
]);
