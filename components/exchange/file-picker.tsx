import { createElement, useRef } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import type { PickedFile } from '@/lib/api/exchange';

/** The parts of a DOM file input this component touches (the web target only). */
interface FileInputElement {
  click: () => void;
  value: string;
  files: ArrayLike<File> | null;
}

/**
 * "Choose a file": on the web a hidden <input type="file"> opened by a button (no extra packages).
 * Other platforms say where to upload from instead.
 */
export function FilePickButton({ label, accept, onPick, testID, disabled, kind = 'quiet' }: {
  label: string;
  /** The input's accept attribute, e.g. ".csv,text/csv". */
  accept?: string;
  onPick: (file: PickedFile) => void;
  testID?: string;
  disabled?: boolean;
  kind?: 'primary' | 'quiet';
}) {
  const input = useRef<FileInputElement | null>(null);
  if (Platform.OS !== 'web') {
    return (
      <AppText variant="caption" tone="muted" testID={testID}>
        Files are uploaded from Sphereline in a web browser.
      </AppText>
    );
  }
  return (
    <View style={styles.wrap}>
      <Button label={label} kind={kind} disabled={disabled} onPress={() => input.current?.click()} testID={testID} />
      {createElement('input', {
        ref: input,
        type: 'file',
        accept,
        style: { display: 'none' },
        'aria-hidden': true,
        tabIndex: -1,
        onChange: () => {
          const file = input.current?.files?.[0];
          if (file) onPick({ name: file.name, sizeBytes: file.size, contentType: file.type, body: file });
          // Choosing the same file again should fire onChange again.
          if (input.current) input.current.value = '';
        },
      })}
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { alignSelf: 'flex-start' } });
