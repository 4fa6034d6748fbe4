import { Notice } from '@/features/ui/components/notice';
import type { RosterFile } from '../api/import-roster';

// Native apps: no document picker is installed, so the roster import is a web-only task for now.

export function RosterFilePicker(_props: { label: string; onPick: (file: RosterFile) => void; disabled?: boolean }) {
  return <Notice>Importing a CSV file works in Squadline on the web: open it in a browser.</Notice>;
}

export function ExampleDownload() {
  return null;
}
