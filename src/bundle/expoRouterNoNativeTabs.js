// Stands in, inside expo-router's layouts/withLayoutContext.js, for the native
// tab bar's trigger element (src/bundle/standIns.js): the app has no native
// tabs, so no child of a layout is ever one of their triggers.
export function isNativeTabTrigger() {
  return false;
}
export function convertTabPropsToOptions() {
  throw new Error('Native tabs are not part of the web app bundle (src/bundle/README.md)');
}
