// Stands in for react-native-screens where expo-router only sets its feature
// flags (src/bundle/standIns.js): the flags tune native iOS and Android
// screens, of which the web app has none.
export const featureFlags = { experiment: {}, stable: {} };
