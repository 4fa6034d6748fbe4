import { useWindowDimensions } from 'react-native';
import { getBreakpoints, type Breakpoints } from './breakpoints.shared';

export { BREAKPOINTS, CONTENT_MAX_WIDTH, getBreakpoints, type Breakpoints } from './breakpoints.shared';

export function useBreakpoints(): Breakpoints {
  const { width } = useWindowDimensions();
  return getBreakpoints(width);
}
