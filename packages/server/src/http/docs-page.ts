import { createRequire } from 'node:module';
import express, { Router } from 'express';

const require = createRequire(import.meta.url);

const PAGE = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<title>Leadline API</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<link rel="stylesheet" href="/api/docs/assets/swagger-ui.css">
</head>
<body>
<div id="docs"></div>
<script src="/api/docs/assets/swagger-ui-bundle.js"></script>
<script src="/api/docs/init.js"></script>
</body>
</html>
`;

const INIT = `window.ui = SwaggerUIBundle({
  url: '/api/v1/openapi.json',
  dom_id: '#docs',
  deepLinking: true,
  withCredentials: true,
  // No outside validator badge: the page must not call any other host.
  validatorUrl: null,
});
`;

/**
 * `/api/docs`: the OpenAPI document rendered by swagger-ui-dist, served from node_modules so the page
 * works offline; no script is inline, so the strict Content-Security-Policy stays on.
 */
export function createDocsRouter(): Router {
  const assets: string = (require('swagger-ui-dist') as { getAbsoluteFSPath(): string }).getAbsoluteFSPath();
  const router = Router();
  router.get('/', (_req, res) => {
    res.type('html').send(PAGE);
  });
  router.get('/init.js', (_req, res) => {
    res.type('application/javascript').send(INIT);
  });
  router.use('/assets', express.static(assets, { index: false, maxAge: '1d' }));
  return router;
}
