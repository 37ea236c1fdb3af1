// Imports that the web bundle answers with another file (metro.config.js):
// parts of packages no screen uses are swapped, inside those packages, for the
// small files beside this one, so the first screen does not load them
// (README.md here says why each can go). Node (server, tests) is unaffected.
const path = require('path');

const root = path.join(__dirname, '..', '..');
const pkg = (name) => path.join(root, 'node_modules', name) + path.sep;
const router = (file) => path.join(root, 'node_modules', 'expo-router', 'build', file);
const here = (file) => path.join(__dirname, file);

/** `from`: where the import is written (file, or folder ending in a separator); `request`: what it asks for; `file`: what it gets. */
const standIns = [
  // zod: English messages only, no JSON Schema reader
  { from: [pkg('zod')], request: /(^|\/)locales\/index(\.js)?$/, file: here('zodLocales.js') },
  { from: [pkg('zod')], request: /(^|\/)from-json-schema(\.js)?$/, file: here('zodFromJsonSchema.js') },
  // zod: no schema compiler and no JSON Schema writer
  { from: [pkg('zod')], request: /^\.\/compile(\.js)?$/, file: here('zodCompile.js') },
  { from: [pkg('zod')], request: /(^|\/)(to-json-schema|json-schema-processors)(\.js)?$/, file: here('zodJsonSchemaWriter.js') },
  // The app's own imports of expo-router: the hooks, Link, Redirect and Slot without the navigators
  { from: ['app', 'src', 'shared'].map((d) => path.join(root, d) + path.sep), request: /^expo-router$/, file: here('expoRouter.js') },
  // Inside expo-router: the error toast needs only the tab bar's height context, not the tab bar
  { from: [router('views/Toast.js')], request: /^\.\.\/react-navigation\/bottom-tabs$/, file: router('react-navigation/bottom-tabs/utils/BottomTabBarHeightContext.js') },
  { from: [router('ExpoRoot.js'), router('getRoutes.js')], request: /^\.\/views\/Sitemap$/, file: here('expoRouterSitemap.js') },
  { from: [router('layouts/withLayoutContext.js')], request: /^\.\.\/native-tabs\/NativeTabTrigger$/, file: here('expoRouterNoNativeTabs.js') },
  { from: [router('layouts/StackClient.js')], request: /^\.\.\/fork\/native-stack\/createNativeStackNavigator$|^\.\/stack-utils$/, file: here('expoRouterNoStack.js') },
  { from: [router('screensFeatureFlags.js')], request: /^react-native-screens$/, file: here('screensFlags.js') },
  // expo-router reads react-native through the index, which brings every component react-native-web has
  // (Expo's Babel preset has rewritten its require('react-native') to the index's path by then)
  { from: [pkg('expo-router')], request: /^react-native(-web\/dist\/index)?$/, file: here('reactNativeForRouter.js') },
];

/** The file that answers `request` written in `origin`, or null for the usual resolution. */
function standInFor(origin, request) {
  const hit = standIns.find((s) => s.request.test(request) && s.from.some((f) => (f.endsWith(path.sep) ? origin.startsWith(f) : origin === f)));
  return hit ? hit.file : null;
}

module.exports = { standIns, standInFor };
