import { createBrowserRouter } from 'react-router-dom';
import { LandingPage } from './routes/landing';
import { NotFoundPage } from './routes/not-found';

/** The site's route table. */
export function createRouter() {
  return createBrowserRouter([
    { path: '/', element: <LandingPage /> },
    { path: '*', element: <NotFoundPage /> },
  ]);
}
