/**
 * The sculpt file chooser on platforms without a browser file input: uploads are made from a computer's
 * browser, so this says so. The web version is file-picker.web.tsx.
 */
import { Notice } from '../ui/notice';

export interface FilePickerProps {
  label: string;
  /** Called with the chosen file, or null when the choice is cleared. */
  onPick: (file: (Blob & { name: string }) | null) => void;
  disabled?: boolean;
}

/** Renders a note that sculpts are uploaded from the web app. */
export function FilePicker(_props: FilePickerProps) {
  return <Notice tone="note">Upload a sculpt from the web app in a computer's browser; the file stays where you exported it.</Notice>;
}
