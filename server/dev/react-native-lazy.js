// What `react-native` (and `react-native-web`) resolve to in the web bundles (see metro.config.cjs): the
// same 63 exports as react-native-web's own index, each loaded the first time it is read.
//
// React Native Web's index re-exports every component and API, and Metro turns re-exports into requires
// at the top of the module even with inline requires on, so the first `import { View } from
// 'react-native'` ran all of them: Animated, the list views, Modal, Switch, Picker and the rest, each
// compiling its StyleSheet. In a Chromium profile of the sign-in page (4x slower CPU) that was most of
// the entry chunk's first long task (our measurement). Here a getter requires one export when something
// first reads it. `react-native-lazy.test.ts` checks that this list matches the installed index.
'use strict';

Object.defineProperty(exports, '__esModule', { value: true });

function lazy(name, load) {
  Object.defineProperty(exports, name, { enumerable: true, get: load });
}

lazy('unstable_createElement', () => require('react-native-web/dist/exports/createElement').default);
lazy('findNodeHandle', () => require('react-native-web/dist/exports/findNodeHandle').default);
lazy('processColor', () => require('react-native-web/dist/exports/processColor').default);
lazy('render', () => require('react-native-web/dist/exports/render').default);
lazy('unmountComponentAtNode', () => require('react-native-web/dist/exports/unmountComponentAtNode').default);
lazy('NativeModules', () => require('react-native-web/dist/exports/NativeModules').default);
lazy('AccessibilityInfo', () => require('react-native-web/dist/exports/AccessibilityInfo').default);
lazy('Alert', () => require('react-native-web/dist/exports/Alert').default);
lazy('Animated', () => require('react-native-web/dist/exports/Animated').default);
lazy('Appearance', () => require('react-native-web/dist/exports/Appearance').default);
lazy('AppRegistry', () => require('react-native-web/dist/exports/AppRegistry').default);
lazy('AppState', () => require('react-native-web/dist/exports/AppState').default);
lazy('AssetRegistry', () => require('react-native-web/dist/exports/AssetRegistry').default);
lazy('BackHandler', () => require('react-native-web/dist/exports/BackHandler').default);
lazy('Clipboard', () => require('react-native-web/dist/exports/Clipboard').default);
lazy('Dimensions', () => require('react-native-web/dist/exports/Dimensions').default);
lazy('Easing', () => require('react-native-web/dist/exports/Easing').default);
lazy('I18nManager', () => require('react-native-web/dist/exports/I18nManager').default);
lazy('Keyboard', () => require('react-native-web/dist/exports/Keyboard').default);
lazy('InteractionManager', () => require('react-native-web/dist/exports/InteractionManager').default);
lazy('LayoutAnimation', () => require('react-native-web/dist/exports/LayoutAnimation').default);
lazy('Linking', () => require('react-native-web/dist/exports/Linking').default);
lazy('NativeEventEmitter', () => require('react-native-web/dist/exports/NativeEventEmitter').default);
lazy('PanResponder', () => require('react-native-web/dist/exports/PanResponder').default);
lazy('PixelRatio', () => require('react-native-web/dist/exports/PixelRatio').default);
lazy('Platform', () => require('react-native-web/dist/exports/Platform').default);
lazy('Share', () => require('react-native-web/dist/exports/Share').default);
lazy('StyleSheet', () => require('react-native-web/dist/exports/StyleSheet').default);
lazy('UIManager', () => require('react-native-web/dist/exports/UIManager').default);
lazy('Vibration', () => require('react-native-web/dist/exports/Vibration').default);
lazy('ActivityIndicator', () => require('react-native-web/dist/exports/ActivityIndicator').default);
lazy('Button', () => require('react-native-web/dist/exports/Button').default);
lazy('CheckBox', () => require('react-native-web/dist/exports/CheckBox').default);
lazy('FlatList', () => require('react-native-web/dist/exports/FlatList').default);
lazy('Image', () => require('react-native-web/dist/exports/Image').default);
lazy('ImageBackground', () => require('react-native-web/dist/exports/ImageBackground').default);
lazy('InputAccessoryView', () => require('react-native-web/dist/exports/InputAccessoryView').default);
lazy('KeyboardAvoidingView', () => require('react-native-web/dist/exports/KeyboardAvoidingView').default);
lazy('Modal', () => require('react-native-web/dist/exports/Modal').default);
lazy('Picker', () => require('react-native-web/dist/exports/Picker').default);
lazy('Pressable', () => require('react-native-web/dist/exports/Pressable').default);
lazy('ProgressBar', () => require('react-native-web/dist/exports/ProgressBar').default);
lazy('RefreshControl', () => require('react-native-web/dist/exports/RefreshControl').default);
lazy('SafeAreaView', () => require('react-native-web/dist/exports/SafeAreaView').default);
lazy('ScrollView', () => require('react-native-web/dist/exports/ScrollView').default);
lazy('SectionList', () => require('react-native-web/dist/exports/SectionList').default);
lazy('StatusBar', () => require('react-native-web/dist/exports/StatusBar').default);
lazy('Switch', () => require('react-native-web/dist/exports/Switch').default);
lazy('Text', () => require('react-native-web/dist/exports/Text').default);
lazy('TextInput', () => require('react-native-web/dist/exports/TextInput').default);
lazy('Touchable', () => require('react-native-web/dist/exports/Touchable').default);
lazy('TouchableHighlight', () => require('react-native-web/dist/exports/TouchableHighlight').default);
lazy('TouchableNativeFeedback', () => require('react-native-web/dist/exports/TouchableNativeFeedback').default);
lazy('TouchableOpacity', () => require('react-native-web/dist/exports/TouchableOpacity').default);
lazy('TouchableWithoutFeedback', () => require('react-native-web/dist/exports/TouchableWithoutFeedback').default);
lazy('View', () => require('react-native-web/dist/exports/View').default);
lazy('VirtualizedList', () => require('react-native-web/dist/exports/VirtualizedList').default);
lazy('YellowBox', () => require('react-native-web/dist/exports/YellowBox').default);
lazy('LogBox', () => require('react-native-web/dist/exports/LogBox').default);
lazy('DeviceEventEmitter', () => require('react-native-web/dist/exports/DeviceEventEmitter').default);
lazy('useColorScheme', () => require('react-native-web/dist/exports/useColorScheme').default);
lazy('useLocaleContext', () => require('react-native-web/dist/exports/useLocaleContext').default);
lazy('useWindowDimensions', () => require('react-native-web/dist/exports/useWindowDimensions').default);
