/**
 * Metro for the web client (issue 15 item 4: first-load JavaScript ≤ 450 KB gzipped).
 * Expo's defaults, plus one resolver rule: zod's main module re-exports all its locale packs
 * (`z.locales`), about 40 KB gzipped that every screen would load although Tallyrun only ever
 * speaks English and never calls `z.locales`. Its locales index is swapped for a module that
 * exports English alone; zod's schemas take their default (English) messages from en.js
 * directly, so every error message stays word for word the same. The server and the tests
 * (Node, not Metro) use zod untouched.
 */
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);

const zodLocalesIndex = /[\\/]node_modules[\\/]zod[\\/]v4[\\/]locales[\\/]index\.(c?js)$/;
const englishOnly = {
  js: path.join(__dirname, 'web-stubs', 'zod-locales-en.js'),
  cjs: path.join(__dirname, 'web-stubs', 'zod-locales-en.cjs'),
};

const resolveBefore = config.resolver.resolveRequest;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  const resolved = (resolveBefore ?? context.resolveRequest)(context, moduleName, platform);
  const match = resolved.type === 'sourceFile' ? zodLocalesIndex.exec(resolved.filePath) : null;
  // The ESM and CommonJS builds each get a stub of their own kind, so en.js is never bundled twice.
  return match ? { type: 'sourceFile', filePath: englishOnly[match[1]] } : resolved;
};

module.exports = config;
