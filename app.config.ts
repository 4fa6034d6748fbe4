// Written without type annotations: Expo loads this file directly, and Node 20 cannot strip types.
const config = {
  name: 'Squadline',
  slug: 'squadline',
  scheme: 'squadline',
  version: '0.1.0',
  orientation: 'portrait',
  userInterfaceStyle: 'light',
  web: {
    bundler: 'metro',
    output: 'static',
    name: 'Squadline',
    shortName: 'Squadline',
    themeColor: '#0E5A45',
    backgroundColor: '#F6F4EF',
  },
  plugins: [
    // Each route is its own download on the web, so the sign-in page does not carry the capture screens.
    ['expo-router', { asyncRoutes: { web: true, default: 'development' }, sitemap: false }],
    'expo-font',
    [
      'expo-image-picker',
      { photosPermission: 'Squadline uses your photos for movement screening.', cameraPermission: 'Squadline uses the camera for movement screening photos.' },
    ],
  ],
  experiments: { typedRoutes: false },
};

export default config;
