/**
 * Hands a CSV text to the person: a file download in the browser; on a
 * device (no download folder to drop it in) the text goes to the clipboard.
 * Returns what happened, in words for the screen.
 */
import * as Clipboard from 'expo-clipboard';
import { Platform } from 'react-native';

export async function saveCsv(fileName: string, csv: string): Promise<string> {
  if (Platform.OS === 'web' && typeof document !== 'undefined') {
    const url = URL.createObjectURL(new Blob([csv], { type: 'text/csv;charset=utf-8' }));
    try {
      const a = document.createElement('a');
      a.href = url;
      a.download = fileName;
      document.body.appendChild(a);
      a.click();
      a.remove();
    } finally {
      // Give the browser a moment to start the download before the URL goes.
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
    }
    return `Downloaded ${fileName}.`;
  }
  await Clipboard.setStringAsync(csv);
  return 'The CSV text is on the clipboard.';
}
