import { createBrowserRouter, Navigate } from 'react-router-dom';
import { StorefrontHomePage } from './routes/storefront/storefront-home.tsx';
import { NotFoundPage } from './routes/not-found.tsx';

/**
 * Platform pages, a studio's storefront (/s/…) and its workspace (/studio/…). The storefront
 * home is in the first bundle; every other page loads its own code when first opened, so a
 * buyer never downloads the workspace.
 */
const page =
  <K extends string>(load: () => Promise<Record<K, React.ComponentType>>, name: K) =>
  async () => ({ Component: (await load())[name] });

export const router = createBrowserRouter([
  { path: '/', lazy: page(() => import('./routes/home.tsx'), 'HomePage') },
  { path: '/sign-in', lazy: page(() => import('./routes/sign-in.tsx'), 'SignInPage') },
  { path: '/sign-in/link-sent', lazy: page(() => import('./routes/sign-in.tsx'), 'LinkSentPage') },
  { path: '/open-a-studio', lazy: page(() => import('./routes/open-a-studio.tsx'), 'OpenStudioPage') },
  { path: '/invites/:token', lazy: page(() => import('./routes/invite.tsx'), 'InvitePage') },
  { path: '/account/orders', lazy: page(() => import('./routes/my-orders.tsx'), 'MyOrdersPage') },
  { path: '/platform/studios', lazy: page(() => import('./routes/platform-studios.tsx'), 'PlatformStudiosPage') },
  { path: '/s/:studioSlug', element: <StorefrontHomePage /> },
  { path: '/s/:studioSlug/blanks/:blankId', lazy: page(() => import('./routes/storefront/blank-page.tsx'), 'BlankPage') },
  { path: '/s/:studioSlug/cart', lazy: page(() => import('./routes/storefront/cart.tsx'), 'CartPage') },
  { path: '/s/:studioSlug/orders/:orderId', lazy: page(() => import('./routes/storefront/order.tsx'), 'OrderPage') },
  { path: '/studio/:studioSlug', lazy: page(() => import('./routes/workspace/overview.tsx'), 'WorkspaceOverviewPage') },
  { path: '/studio/:studioSlug/team', lazy: page(() => import('./routes/workspace/team.tsx'), 'TeamPage') },
  { path: '/studio/:studioSlug/audit', lazy: page(() => import('./routes/workspace/audit.tsx'), 'AuditLogPage') },
  { path: '/studio/:studioSlug/settings', lazy: page(() => import('./routes/workspace/settings.tsx'), 'SettingsPage') },
  { path: '/studio/:studioSlug/orders', lazy: page(() => import('./routes/workspace/orders/orders.tsx'), 'OrdersPage') },
  { path: '/studio/:studioSlug/orders/:orderId', lazy: page(() => import('./routes/workspace/orders/order.tsx'), 'StaffOrderPage') },
  { path: '/studio/:studioSlug/items/:itemId', lazy: page(() => import('./routes/workspace/orders/item.tsx'), 'StaffItemPage') },
  { path: '/s/:studioSlug/proofs/:token', lazy: page(() => import('./routes/storefront/proof.tsx'), 'ProofPage') },
  { path: '/studio/:studioSlug/review', lazy: page(() => import('./routes/workspace/orders/review.tsx'), 'ReviewPage') },
  { path: '/studio/:studioSlug/production', lazy: page(() => import('./routes/workspace/production/production.tsx'), 'ProductionPage') },
  {
    path: '/studio/:studioSlug/production/batches/:batchId',
    lazy: page(() => import('./routes/workspace/production/batch.tsx'), 'BatchPage'),
  },
  { path: '/s/:studioSlug/replace/:token', lazy: page(() => import('./routes/storefront/replace-photo.tsx'), 'ReplacePhotoPage') },
  { path: '/studio/:studioSlug/catalog', element: <Navigate to="blanks" replace /> },
  { path: '/studio/:studioSlug/catalog/blanks', lazy: page(() => import('./routes/workspace/catalog/blanks.tsx'), 'BlanksPage') },
  { path: '/studio/:studioSlug/catalog/blanks/:blankId', lazy: page(() => import('./routes/workspace/catalog/blank.tsx'), 'BlankPage') },
  { path: '/studio/:studioSlug/catalog/materials', lazy: page(() => import('./routes/workspace/catalog/materials.tsx'), 'MaterialsPage') },
  { path: '/studio/:studioSlug/catalog/machines', lazy: page(() => import('./routes/workspace/catalog/machines.tsx'), 'MachinesPage') },
  { path: '/studio/:studioSlug/catalog/recipes', lazy: page(() => import('./routes/workspace/catalog/recipes.tsx'), 'RecipesPage') },
  { path: '*', element: <NotFoundPage /> },
]);
