import express, { type Express } from 'express';
import fs from 'node:fs';
import path from 'node:path';

/**
 * Serves the exported web client. Expo's static export writes one HTML file per route
 * (`users.html`, `meter-runs/[id].html`); a deep link to a dynamic route is answered with the
 * file of its pattern so the client router boots on the right screen.
 */
export function serveWebClient(app: Express, webDir: string) {
  const root = path.resolve(webDir);
  if (!fs.existsSync(path.join(root, 'index.html'))) return false;
  // redirect: false — /setup must not become /setup/ when a folder of the same name exists.
  app.use(express.static(root, { extensions: ['html'], index: 'index.html', maxAge: '1h', redirect: false }));
  app.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/')) return next();
    const segments = req.path.split('/').filter(Boolean);
    // Walk down the folders, taking a literal segment where it exists and a [param] one otherwise.
    let dir = root;
    for (let i = 0; i < segments.length; i++) {
      const last = i === segments.length - 1;
      const entries = fs.existsSync(dir) ? fs.readdirSync(dir) : [];
      // A folder route (meter-runs/index.html) answers for its own path too.
      if (last && entries.includes(segments[i]) && fs.existsSync(path.join(dir, segments[i], 'index.html')))
        return res.sendFile(path.join(dir, segments[i], 'index.html'));
      const literal = last ? `${segments[i]}.html` : segments[i];
      const dynamic = entries.find((e) => /^\[.+\]/.test(e) && (last ? e.endsWith('.html') : !e.endsWith('.html')));
      const pick = entries.includes(literal) ? literal : dynamic;
      if (!pick) break;
      dir = path.join(dir, pick);
      if (last && pick.endsWith('.html')) return res.sendFile(dir);
    }
    const notFound = path.join(root, '+not-found.html');
    res.status(404).sendFile(fs.existsSync(notFound) ? notFound : path.join(root, 'index.html'));
  });
  return true;
}
