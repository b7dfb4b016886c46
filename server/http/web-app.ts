/**
 * Serves the exported web app (dist/) on the API's port: hashed bundles with a long cache, index.html for any
 * other non-API path so that deep links into the single-page app work. When the app has not been built yet
 * the pages answer 503 with a short explanation instead of failing.
 */
import fs from 'node:fs';
import path from 'node:path';
import express, { type Router } from 'express';

const NOT_BUILT_PAGE = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Sheetsmith: web app not built</title></head>
<body style="font-family: system-ui, sans-serif; max-width: 36rem; margin: 4rem auto; line-height: 1.5">
<h1>Web app not built</h1>
<p>The Sheetsmith server is running and its API answers under <code>/api</code>, but the web app has not
been built into the web root yet.</p>
<p>Run <code>npm start</code> (it builds the app when its sources change) or <code>npm run web:build</code>,
then reload this page.</p>
</body></html>
`;

/** Returns a router serving `webRoot` (absolute or relative to the working directory). */
export function webAppRouter(webRoot: string): Router {
  const root = path.resolve(webRoot);
  const indexFile = path.join(root, 'index.html');
  const router = express.Router();
  router.use(
    express.static(root, {
      index: false,
      setHeaders: (res, filePath) => {
        // Bundles under _expo/static carry a content hash in their names, so they never change in place.
        const hashed = filePath.includes(`${path.sep}_expo${path.sep}static${path.sep}`);
        res.setHeader('Cache-Control', hashed ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  router.get('/{*splat}', (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/')) {
      next();
      return;
    }
    fs.access(indexFile, fs.constants.R_OK, (missing) => {
      if (missing) {
        res.status(503).type('html').setHeader('Retry-After', '30').send(NOT_BUILT_PAGE);
        return;
      }
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(indexFile);
    });
  });
  return router;
}
