import type { Express, NextFunction, Request, Response } from 'express';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/**
 * Serves the exported web client. Expo's static export writes one HTML file per route
 * (`users.html`, `meter-runs/[id].html`); a deep link to a dynamic route is answered with the
 * file of its pattern so the client router boots on the right screen. Every file goes out as the
 * brotli or gzip copy written beside it at export (server/cli/web-export.ts) when the browser
 * accepts one; files whose name carries a content hash are cached for a year, the rest revalidate.
 */
export function serveWebClient(app: Express, webDir: string) {
  const root = path.resolve(webDir);
  if (!fs.existsSync(path.join(root, 'index.html'))) return false;
  const policy = contentSecurityPolicy(root);
  app.use((req, res, next) => {
    if (!req.path.startsWith('/api/')) res.setHeader('Content-Security-Policy', policy);
    next();
  });
  app.use((req, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || req.path.startsWith('/api/')) return next();
    const file = staticFile(root, req.path);
    if (!file) return next();
    sendWebFile(req, res, next, file);
  });
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
        return sendWebFile(req, res, next, path.join(dir, segments[i], 'index.html'));
      const literal = last ? `${segments[i]}.html` : segments[i];
      const dynamic = entries.find((e) => /^\[.+\]/.test(e) && (last ? e.endsWith('.html') : !e.endsWith('.html')));
      const pick = entries.includes(literal) ? literal : dynamic;
      if (!pick) break;
      dir = path.join(dir, pick);
      if (last && pick.endsWith('.html')) return sendWebFile(req, res, next, dir);
    }
    const notFound = path.join(root, '+not-found.html');
    res.status(404);
    sendWebFile(req, res, next, fs.existsSync(notFound) ? notFound : path.join(root, 'index.html'));
  });
  return true;
}

/** Expo and the copied fonts name assets `<name>-<md5>.<ext>` or `<name>.<md5>.<ext>`: such a name changes with its content. */
export const HASHED_NAME = /[-.][0-9a-f]{32}(@\dx)?\.[a-z0-9]+$/i;

/** The encodings written beside each file at export, in the order the server prefers them. */
export const PRECOMPRESSED = [
  { encoding: 'br', suffix: '.br' },
  { encoding: 'gzip', suffix: '.gz' },
] as const;

/**
 * The file of the export a path names: itself, `<path>.html`, or the folder's index.html. Dotfiles
 * (.export-stamp) and the compressed copies are not pages; a path that leaves the folder is refused.
 */
function staticFile(root: string, urlPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  if (decoded.includes('\0') || decoded.split('/').some((segment) => segment.startsWith('.'))) return null;
  if (/\.(br|gz)$/.test(decoded)) return null;
  const full = path.join(root, decoded);
  if (full !== root && !full.startsWith(root + path.sep)) return null;
  // A folder answers only by its index.html when asked with a trailing slash or at the root; /setup
  // must not become /setup/ when a folder of the same name exists, so the fallback route decides.
  const candidates = decoded.endsWith('/') ? [path.join(full, 'index.html')] : [full, `${full}.html`];
  return candidates.find((candidate) => isFile(candidate)) ?? null;
}

const isFile = (file: string) => {
  try {
    return fs.statSync(file).isFile();
  } catch {
    return false;
  }
};

/**
 * Sends one file of the export, as its pre-compressed copy when the browser accepts that encoding.
 * Vary tells caches the answer depends on Accept-Encoding; Content-Type is the original file's.
 */
function sendWebFile(req: Request, res: Response, next: NextFunction, file: string) {
  const copies = PRECOMPRESSED.filter(({ suffix }) => isFile(file + suffix));
  let sent = file;
  if (copies.length > 0) {
    res.vary('Accept-Encoding');
    // The server's order, not the header's: browsers list gzip before br at equal quality.
    const copy = copies.find((c) => req.acceptsEncodings(c.encoding) === c.encoding);
    if (copy) {
      sent = file + copy.suffix;
      res.setHeader('Content-Encoding', copy.encoding);
      res.type(path.extname(file));
    }
  }
  res.setHeader(
    'Cache-Control',
    HASHED_NAME.test(path.basename(file)) ? 'public, max-age=31536000, immutable' : 'no-cache',
  );
  res.sendFile(sent, { cacheControl: false, dotfiles: 'allow' }, (err) => {
    // A browser that leaves the page drops its pending font and script requests: not a server error.
    if (err && (err as NodeJS.ErrnoException).code === 'ECONNABORTED') return;
    if (err && !res.headersSent) next(err);
  });
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
