// The SVG elements the photo overlay draws with. On phones they come from react-native-svg; the web has
// its own sibling (`overlay-svg.web.tsx`) that draws plain DOM SVG.
export { default as Svg, Circle, G, Image, Line, Rect, Text } from 'react-native-svg';
