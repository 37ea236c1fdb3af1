// Metro bundles only the client (app/, src/, shared/) and the server code that
// is plain TypeScript shared with it: the analysis engine and the feed checks
// it calls, which the web app runs on its offline copy, and the carriage
// search, which it runs on the same copy (src/offline/README.md). The rest of
// the server, scripts, tests and the local database folder are kept out of the
// bundle and the watcher.
const { getDefaultConfig } = require('expo/metro-config');
const path = require('path');

const config = getDefaultConfig(__dirname);
const escapeRegExp = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const own = (dir) => new RegExp('^' + escapeRegExp(path.join(__dirname, dir)) + '\\/.*');
// server/services itself stays open (the file crawler skips a blocked folder
// whole); of its files only carriageSearch.ts is let through.
const serverExceptShared = new RegExp('^' + escapeRegExp(path.join(__dirname, 'server')) + '\\/(?!(?:engine|checks)(?:\\/|$)|services(?:\\/carriageSearch\\.ts)?$).*');
config.resolver.blockList = [serverExceptShared, ...['scripts', 'test', '.data', 'artifacts', 'dist'].map(own)];

// Parts of packages that no screen uses, swapped inside those packages for the
// small stand-ins in src/bundle/ (its README says why each one can go).
const { standInFor } = require('./src/bundle/standIns');
config.resolver.resolveRequest = (context, moduleName, platform) => {
  const standIn = platform === 'web' ? standInFor(context.originModulePath, moduleName) : null;
  if (standIn) return { type: 'sourceFile', filePath: standIn };
  return context.resolveRequest(context, moduleName, platform);
};
module.exports = config;
