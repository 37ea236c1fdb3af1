// What the app's own files get when they import 'expo-router' in the web
// bundle (src/bundle/standIns.js): the same functions and components, taken
// from the files that define them. The package's index also re-exports the
// stack and tab navigators, themes and the route list screen, which reach deep
// into react-navigation; the app uses none of them. A name the app imports
// from 'expo-router' must be listed here (test/unit/project/bundle-stand-ins.test.ts).
export { useGlobalSearchParams, useLocalSearchParams, usePathname, useRouter, useSegments } from 'expo-router/build/hooks';
export { router } from 'expo-router/build/imperative-api';
export { Link, Redirect } from 'expo-router/build/link/Link';
export { Slot } from 'expo-router/build/views/Navigator';
