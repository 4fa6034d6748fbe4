import { useRef } from 'react';
import { Button } from '@/features/ui/components/button';
import { colors, fonts } from '@/features/ui/theme';
import type { RosterFile } from '../api/import-roster';
import { ROSTER_EXAMPLE_LINE, ROSTER_HEADER_LINE } from '../schemas';

// Web: a hidden <input type="file"> behind one of our buttons (expo-image-picker only picks images).

export function RosterFilePicker({ label, onPick, disabled }: { label: string; onPick: (file: RosterFile) => void; disabled?: boolean }) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <>
      <input
        ref={input}
        type="file"
        accept=".csv,text/csv,text/plain"
        data-testid="roster-file-input"
        style={{ display: 'none' }}
        onChange={(event) => {
          const file = event.currentTarget.files?.[0];
          // Cleared so that choosing the same (corrected) file again fires another change.
          event.currentTarget.value = '';
          if (file) onPick({ name: file.name, size: file.size, blob: file });
        }}
      />
      <Button label={label} testID="roster-choose-file" disabled={disabled} onPress={() => input.current?.click()} />
    </>
  );
}

const EXAMPLE = `${ROSTER_HEADER_LINE}\n${ROSTER_EXAMPLE_LINE}\n`;

export function ExampleDownload() {
  return (
    <a
      href={`data:text/csv;charset=utf-8,${encodeURIComponent(EXAMPLE)}`}
      download="squadline-roster-example.csv"
      data-testid="roster-example-download"
      style={{ color: colors.pine, fontFamily: fonts.bold, fontSize: 17, minHeight: 48, display: 'inline-flex', alignItems: 'center' }}
    >
      Download an example file
    </a>
  );
}
