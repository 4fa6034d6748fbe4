import { useFonts } from 'expo-font';
import { FONT_SOURCES } from './font-sources';

/** Native: the app waits for its fonts before the first render (they are local files, so it is quick). */
export function useAppFonts(): boolean {
  const [loaded, error] = useFonts(FONT_SOURCES);
  return loaded || error !== null;
}
