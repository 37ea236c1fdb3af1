// Metro bundles only the client (app/, src/, shared/) and the two server
// folders that are plain TypeScript shared with it: the analysis engine and the
// feed checks it calls, which the web app runs on its offline copy
// (src/offline/README.md). The rest of the server, scripts, tests and the local
// database folder are kept out of the bundle and the watcher.
const { getDefaultConfig } = require('expo/metro-config');
const path = require('path');

const config = getDefaultConfig(__dirname);
const escapeRegExp = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const own = (dir) => new RegExp('^' + escapeRegExp(path.join(__dirname, dir)) + '\\/.*');
const serverExceptShared = new RegExp('^' + escapeRegExp(path.join(__dirname, 'server')) + '\\/(?!(?:engine|checks)(?:\\/|$)).*');
config.resolver.blockList = [serverExceptShared, ...['scripts', 'test', '.data', 'artifacts', 'dist'].map(own)];
module.exports = config;
