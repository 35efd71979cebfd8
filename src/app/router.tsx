import { createBrowserRouter } from 'react-router-dom';
import { HomePage } from './routes/home.tsx';
import { SignInPage } from './routes/sign-in.tsx';
import { NotFoundPage } from './routes/not-found.tsx';
import { StorefrontHomePage } from './routes/storefront/storefront-home.tsx';
import { WorkspaceHomePage } from './routes/workspace/workspace-home.tsx';

/** Platform pages, a studio's storefront (/s/…) and its workspace (/studio/…). */
export const router = createBrowserRouter([
  { path: '/', element: <HomePage /> },
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/s/:studioSlug', element: <StorefrontHomePage /> },
  { path: '/studio/:studioSlug', element: <WorkspaceHomePage /> },
  { path: '*', element: <NotFoundPage /> },
]);
