import { lazy } from 'react';
import { createBrowserRouter } from 'react-router-dom';
import { AppShell } from './layout/app-shell';
import { RequireSignIn } from './layout/require-sign-in';

// One chunk per page, so the first load carries only the shell and the page asked for.
const LandingPage = lazy(() => import('./routes/landing').then((m) => ({ default: m.LandingPage })));
const SignInPage = lazy(() => import('./routes/sign-in').then((m) => ({ default: m.SignInPage })));
const DivePage = lazy(() => import('./routes/dive').then((m) => ({ default: m.DivePage })));
const PreviewDivePage = lazy(() => import('./routes/preview-dive').then((m) => ({ default: m.PreviewDivePage })));
const NotFoundPage = lazy(() => import('./routes/not-found').then((m) => ({ default: m.NotFoundPage })));

/** The site's route table. */
export function createRouter() {
  return createBrowserRouter([
    {
      element: <AppShell />,
      children: [
        { path: '/', element: <LandingPage /> },
        { path: '/sign-in', element: <SignInPage /> },
        { path: '/preview/dive', element: <PreviewDivePage /> },
        { element: <RequireSignIn />, children: [{ path: '/dives/:diveId', element: <DivePage /> }] },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
