import { lazy } from 'react';
import { createBrowserRouter } from 'react-router-dom';
import { AppShell } from './layout/app-shell';
import { RequireSignIn } from './layout/require-sign-in';

// One chunk per page, so the first load carries only the shell and the page asked for.
// `/` is the home page when signed in and the landing page for visitors.
const StartPage = lazy(() => import('./routes/home').then((m) => ({ default: m.StartPage })));
const SignInPage = lazy(() => import('./routes/sign-in').then((m) => ({ default: m.SignInPage })));
const DivePage = lazy(() => import('./routes/dive').then((m) => ({ default: m.DivePage })));
const PreviewDivePage = lazy(() => import('./routes/preview-dive').then((m) => ({ default: m.PreviewDivePage })));
const ForgotPasswordPage = lazy(() =>
  import('./routes/forgot-password').then((m) => ({ default: m.ForgotPasswordPage })),
);
const ResetPasswordPage = lazy(() => import('./routes/reset-password').then((m) => ({ default: m.ResetPasswordPage })));
const AcceptInvitationPage = lazy(() =>
  import('./routes/accept-invitation').then((m) => ({ default: m.AcceptInvitationPage })),
);
const TokensPage = lazy(() => import('./routes/tokens').then((m) => ({ default: m.TokensPage })));
const MembersPage = lazy(() => import('./routes/members').then((m) => ({ default: m.MembersPage })));
const DevMailboxPage = lazy(() => import('./routes/dev-mailbox').then((m) => ({ default: m.DevMailboxPage })));
const UploadPage = lazy(() => import('./routes/upload').then((m) => ({ default: m.UploadPage })));
const ProjectPage = lazy(() => import('./routes/project').then((m) => ({ default: m.ProjectPage })));
const NotFoundPage = lazy(() => import('./routes/not-found').then((m) => ({ default: m.NotFoundPage })));

/** The site's route table. */
export function createRouter() {
  return createBrowserRouter([
    {
      element: <AppShell />,
      children: [
        { path: '/', element: <StartPage /> },
        { path: '/sign-in', element: <SignInPage /> },
        { path: '/preview/dive', element: <PreviewDivePage /> },
        { path: '/forgot-password', element: <ForgotPasswordPage /> },
        { path: '/reset-password', element: <ResetPasswordPage /> },
        { path: '/accept-invitation', element: <AcceptInvitationPage /> },
        {
          element: <RequireSignIn />,
          children: [
            { path: '/dives/:diveId', element: <DivePage /> },
            { path: '/projects/:projectId', element: <ProjectPage /> },
            { path: '/upload', element: <UploadPage /> },
            { path: '/tokens', element: <TokensPage /> },
            { path: '/members', element: <MembersPage /> },
            { path: '/dev/mailbox', element: <DevMailboxPage /> },
          ],
        },
        { path: '*', element: <NotFoundPage /> },
      ],
    },
  ]);
}
