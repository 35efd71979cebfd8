import { createBrowserRouter, Navigate } from 'react-router-dom';
import { HomePage } from './routes/home.tsx';
import { LinkSentPage, SignInPage } from './routes/sign-in.tsx';
import { OpenStudioPage } from './routes/open-a-studio.tsx';
import { InvitePage } from './routes/invite.tsx';
import { NotFoundPage } from './routes/not-found.tsx';
import { StorefrontHomePage } from './routes/storefront/storefront-home.tsx';
import { BlankPage as StorefrontBlankPage } from './routes/storefront/blank-page.tsx';
import { CartPage } from './routes/storefront/cart.tsx';
import { OrderPage } from './routes/storefront/order.tsx';
import { WorkspaceOverviewPage } from './routes/workspace/overview.tsx';
import { TeamPage } from './routes/workspace/team.tsx';
import { SettingsPage } from './routes/workspace/settings.tsx';
import { PlatformStudiosPage } from './routes/platform-studios.tsx';
import { BlanksPage } from './routes/workspace/catalog/blanks.tsx';
import { BlankPage } from './routes/workspace/catalog/blank.tsx';
import { MaterialsPage } from './routes/workspace/catalog/materials.tsx';
import { MachinesPage } from './routes/workspace/catalog/machines.tsx';
import { RecipesPage } from './routes/workspace/catalog/recipes.tsx';

/** Platform pages, a studio's storefront (/s/…) and its workspace (/studio/…). */
export const router = createBrowserRouter([
  { path: '/', element: <HomePage /> },
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/sign-in/link-sent', element: <LinkSentPage /> },
  { path: '/open-a-studio', element: <OpenStudioPage /> },
  { path: '/invites/:token', element: <InvitePage /> },
  { path: '/platform/studios', element: <PlatformStudiosPage /> },
  { path: '/s/:studioSlug', element: <StorefrontHomePage /> },
  { path: '/s/:studioSlug/blanks/:blankId', element: <StorefrontBlankPage /> },
  { path: '/s/:studioSlug/cart', element: <CartPage /> },
  { path: '/s/:studioSlug/orders/:orderId', element: <OrderPage /> },
  { path: '/studio/:studioSlug', element: <WorkspaceOverviewPage /> },
  { path: '/studio/:studioSlug/team', element: <TeamPage /> },
  { path: '/studio/:studioSlug/settings', element: <SettingsPage /> },
  { path: '/studio/:studioSlug/catalog', element: <Navigate to="blanks" replace /> },
  { path: '/studio/:studioSlug/catalog/blanks', element: <BlanksPage /> },
  { path: '/studio/:studioSlug/catalog/blanks/:blankId', element: <BlankPage /> },
  { path: '/studio/:studioSlug/catalog/materials', element: <MaterialsPage /> },
  { path: '/studio/:studioSlug/catalog/machines', element: <MachinesPage /> },
  { path: '/studio/:studioSlug/catalog/recipes', element: <RecipesPage /> },
  { path: '*', element: <NotFoundPage /> },
]);
