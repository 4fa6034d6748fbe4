import { useLocalSearchParams } from 'expo-router';
import { CaptureFlow } from '@/features/screening/components/capture/capture-flow';

// The capture flow scrolls itself so Back and Next stay at the bottom of the screen.
export default function CaptureRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <CaptureFlow key={String(id)} id={String(id)} />;
}
