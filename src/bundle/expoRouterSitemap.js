// Stands in for expo-router's route list screen (/_sitemap) in the web bundle
// (src/bundle/standIns.js): the address answers as any unknown one does, and
// the list's scroll view, links and device details stay off the first screen.
export { Unmatched as Sitemap } from 'expo-router/build/views/Unmatched';
export function getNavOptions() {
  return {};
}
