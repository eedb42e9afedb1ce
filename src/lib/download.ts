// Starts a file download from an API address. On the web an <a download> click lets the browser
// save the file with the session cookie; native builds hand the address to the system.
import { Linking, Platform } from 'react-native';

export function startDownload(url: string): void {
  if (Platform.OS === 'web' && typeof document !== 'undefined') {
    const a = document.createElement('a');
    a.href = url;
    a.download = '';
    a.rel = 'noopener';
    a.style.display = 'none';
    document.body.appendChild(a);
    a.click();
    a.remove();
    return;
  }
  void Linking.openURL(url);
}

/**
 * Web only: asks for one local text file (e.g. a CSV) and resolves with its name and text, or
 * null when the person cancels. The hidden input is attached to the page while the dialog is open.
 */
export function pickTextFile(accept: string): Promise<{ name: string; text: string } | null> {
  if (Platform.OS !== 'web' || typeof document === 'undefined') return Promise.resolve(null);
  return new Promise((resolve, reject) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    const done = () => input.remove();
    input.addEventListener('change', () => {
      const file = input.files?.[0];
      done();
      if (!file) return resolve(null);
      file.text().then((text) => resolve({ name: file.name, text }), reject);
    });
    input.addEventListener('cancel', () => {
      done();
      resolve(null);
    });
    document.body.appendChild(input);
    input.click();
  });
}
