import { createElement, useRef, type ChangeEvent } from 'react';
import { Button } from '@/components/ui/button';

export type FilePickerProps = {
  label: string;
  /** File name extensions the picker offers (the server still judges the content). */
  accept: readonly string[];
  disabled?: boolean;
  onPick: (file: File) => void;
  testID?: string;
};

/** A button that opens the browser's file chooser and hands over the file picked. */
export function FilePicker({ label, accept, disabled, onPick, testID }: FilePickerProps) {
  const input = useRef<HTMLInputElement | null>(null);
  const picked = (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    // Cleared so that picking the same file again is a change too.
    event.target.value = '';
    if (file !== undefined) onPick(file);
  };
  return (
    <>
      <Button label={label} tone="secondary" disabled={disabled} onPress={() => input.current?.click()} testID={testID} />
      {createElement('input', {
        ref: input,
        type: 'file',
        accept: accept.join(','),
        onChange: picked,
        style: { display: 'none' },
        'aria-hidden': true,
        tabIndex: -1,
        'data-testid': testID === undefined ? undefined : `${testID}-input`,
      })}
    </>
  );
}
