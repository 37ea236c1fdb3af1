// Metro bundles only the client (app/, src/, shared/). The server, scripts,
// tests and the local database folder are kept out of the bundle and the watcher.
const { getDefaultConfig } = require('expo/metro-config');
const path = require('path');

const config = getDefaultConfig(__dirname);
const escapeRegExp = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const own = (dir) => new RegExp('^' + escapeRegExp(path.join(__dirname, dir)) + '\\/.*');
config.resolver.blockList = ['server', 'scripts', 'test', '.data', 'artifacts', 'dist'].map(own);
module.exports = config;
