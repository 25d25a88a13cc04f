// zod's locales index for the web bundle, English only (see metro.config.js).
export { default as en } from 'zod/v4/locales/en.js';
