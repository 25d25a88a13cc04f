// zod's locales index (CommonJS build) for the web bundle, English only (see metro.config.js).
'use strict';
Object.defineProperty(exports, '__esModule', { value: true });
exports.en = require('zod/v4/locales/en.cjs');
