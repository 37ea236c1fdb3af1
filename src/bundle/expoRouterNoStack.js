// Stands in, inside expo-router's layouts/StackClient.js, for the native stack
// navigator and its header and toolbar parts (src/bundle/standIns.js). The
// app's layouts use Slot, never Stack; StackClient.js stays in the bundle only
// because Slot takes its router (StackRouter) from it.
function notBundled(what) {
  const fail = () => {
    throw new Error(`${what} is not part of the web app bundle (src/bundle/README.md)`);
  };
  return fail;
}

export function createNativeStackNavigator() {
  return { Navigator: notBundled('The stack navigator') };
}
export const StackHeader = notBundled('Stack.Header');
export const StackScreen = notBundled('Stack.Screen');
export const StackSearchBar = notBundled('Stack.SearchBar');
export const StackTitle = notBundled('Stack.Title');
export const StackToolbar = notBundled('Stack.Toolbar');
export const appendScreenStackPropsToOptions = notBundled('Stack options');
export const mapProtectedScreen = notBundled('Stack.Protected');
export const validateStackPresentation = notBundled('Stack options');
