import { Slot } from 'expo-router';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { onUnauthorized } from '@/features/api/client';
import { authKeys } from '@/features/auth/api/keys';
import { registerServiceWorker } from '@/features/offline/service-worker';
import { markAppStarted } from '@/features/ui/app-started';
import { useAppFonts } from '@/features/ui/use-app-fonts';

export default function RootLayout() {
  const [client] = useState(
    // offlineFirst: without a connection a query still runs once, so screens kept on the device answer.
    () => new QueryClient({ defaultOptions: { queries: { retry: 1, refetchOnWindowFocus: false, networkMode: 'offlineFirst' } } }),
  );
  useEffect(markAppStarted, []);
  useEffect(registerServiceWorker, []);
  // A 401 anywhere means the session is gone: forget the signed-in person, the guards redirect.
  useEffect(() => onUnauthorized(() => client.setQueryData(authKeys.me(), null)), [client]);
  const fontsReady = useAppFonts();
  if (!fontsReady) return null;
  return (
    <QueryClientProvider client={client}>
      <Slot />
    </QueryClientProvider>
  );
}
