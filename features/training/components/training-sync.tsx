import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { registerSender } from '@/features/offline/device-handle';
import { sendAttendance } from '../api/send-attendance';

/** Sends the records of who took part kept on this device, whatever screen is open. Renders nothing. */
export function TrainingSync() {
  const client = useQueryClient();
  useEffect(() => {
    registerSender('attendance', (entry) => sendAttendance(entry, client));
  }, [client]);
  return null;
}
