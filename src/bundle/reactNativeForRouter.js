// What expo-router gets for `require('react-native')` in the web bundle
// (standIns.js): the react-native-web parts its code uses, each from its own
// file. react-native-web's index brings every component it has (modal, pickers,
// switches, gesture responder, lists...) and expo-router, being CommonJS,
// reaches them all through it; the app's own files import each part directly
// already (Expo's Babel preset rewrites them). standIns.test.ts checks this
// list against every name expo-router's files read from 'react-native'.
export { default as ActivityIndicator } from 'react-native-web/dist/exports/ActivityIndicator';
export { default as Animated } from 'react-native-web/dist/exports/Animated';
export { default as Appearance } from 'react-native-web/dist/exports/Appearance';
export { default as BackHandler } from 'react-native-web/dist/exports/BackHandler';
export { default as Dimensions } from 'react-native-web/dist/exports/Dimensions';
export { default as Easing } from 'react-native-web/dist/exports/Easing';
export { default as I18nManager } from 'react-native-web/dist/exports/I18nManager';
export { default as Image } from 'react-native-web/dist/exports/Image';
export { default as InteractionManager } from 'react-native-web/dist/exports/InteractionManager';
export { default as Keyboard } from 'react-native-web/dist/exports/Keyboard';
export { default as Linking } from 'react-native-web/dist/exports/Linking';
export { default as PixelRatio } from 'react-native-web/dist/exports/PixelRatio';
export { default as Platform } from 'react-native-web/dist/exports/Platform';
export { default as Pressable } from 'react-native-web/dist/exports/Pressable';
export { default as ScrollView } from 'react-native-web/dist/exports/ScrollView';
export { default as StatusBar } from 'react-native-web/dist/exports/StatusBar';
export { default as StyleSheet } from 'react-native-web/dist/exports/StyleSheet';
export { default as Text } from 'react-native-web/dist/exports/Text';
export { default as TextInput } from 'react-native-web/dist/exports/TextInput';
export { default as UIManager } from 'react-native-web/dist/exports/UIManager';
export { default as View } from 'react-native-web/dist/exports/View';
export { default as useColorScheme } from 'react-native-web/dist/exports/useColorScheme';
