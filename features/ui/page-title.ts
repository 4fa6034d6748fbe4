import { useEffect } from 'react';
import { Platform } from 'react-native';

export const APP_NAME = 'Squadline';

/** The browser tab's title for the screen shown: "Athletes · Squadline". Nothing on native. */
export function usePageTitle(title: string | null | undefined) {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof document === 'undefined') return;
    document.title = title ? `${title} · ${APP_NAME}` : APP_NAME;
  }, [title]);
}
