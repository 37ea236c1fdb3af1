// Stands in for zod's table of every language's error messages in the web
// app's bundle (metro.config.js): the app speaks English only, and the other
// tables were about 45 kB of compressed script on the first screen.
export { default as en } from 'zod/v4/locales/en.js';
