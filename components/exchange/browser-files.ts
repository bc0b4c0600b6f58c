/**
 * Asks the person for one file with the browser's file chooser; resolves with it, or undefined when they cancel.
 * The web is the app's target; elsewhere there is no chooser and it resolves undefined.
 */
export function pickFile(accept: string): Promise<File | undefined> {
  if (typeof document === 'undefined') return Promise.resolve(undefined);
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    input.addEventListener('change', () => {
      resolve(input.files?.[0]);
      input.remove();
    });
    input.addEventListener('cancel', () => {
      resolve(undefined);
      input.remove();
    });
    document.body.appendChild(input);
    input.click();
  });
}

/**
 * Downloads a file the API sends as an attachment, staying on the page (a link with `download`, clicked); off the
 * web, the system opens the address.
 */
export function startDownload(url: string, openElsewhere: (url: string) => void): void {
  if (typeof document === 'undefined') {
    openElsewhere(url);
    return;
  }
  const link = document.createElement('a');
  link.href = url;
  link.download = '';
  link.rel = 'noopener';
  document.body.appendChild(link);
  link.click();
  link.remove();
}
