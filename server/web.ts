import express, { type Express } from 'express';
import crypto from 'node:crypto';
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
  const policy = contentSecurityPolicy(root);
  app.use((req, res, next) => {
    if (!req.path.startsWith('/api/')) res.setHeader('Content-Security-Policy', policy);
    next();
  });
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

/**
 * A strict content security policy for the exported client (issue 12 §10). The export bootstraps
 * with a small inline script and ships its reset and react-native-web styles as inline style
 * blocks, so those exact blocks are allowed by their hashes, read from the exported HTML at
 * start-up, never by 'unsafe-inline'. react-native-web adds its rules through the CSSOM (insertRule
 * into that same style block), which a policy does not govern. Style attributes stay allowed: the
 * server-rendered markup carries them, and an attribute cannot run script.
 */
export function contentSecurityPolicy(root: string): string {
  const scripts = new Set<string>();
  const styles = new Set<string>();
  for (const file of htmlFiles(root)) {
    const html = fs.readFileSync(file, 'utf8');
    for (const m of html.matchAll(/<script(?![^>]*\ssrc=)[^>]*>([\s\S]*?)<\/script>/g)) scripts.add(sha256(m[1]));
    for (const m of html.matchAll(/<style[^>]*>([\s\S]*?)<\/style>/g)) styles.add(sha256(m[1]));
  }
  const list = (hashes: Set<string>) => [...hashes].map((h) => ` '${h}'`).join('');
  return [
    "default-src 'self'",
    `script-src 'self'${list(scripts)}`,
    `style-src-elem 'self'${list(styles)}`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "frame-ancestors 'none'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
  ].join('; ');
}

const sha256 = (text: string) => `sha256-${crypto.createHash('sha256').update(text, 'utf8').digest('base64')}`;

function htmlFiles(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return htmlFiles(full);
    return entry.name.endsWith('.html') ? [full] : [];
  });
}
