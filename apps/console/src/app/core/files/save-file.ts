/** Hands a downloaded file to the browser as a download with the given name. */
export function saveFile(blob: Blob, fileName: string, documentRef: Document = document): void {
  const url = URL.createObjectURL(blob);
  const link = documentRef.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  documentRef.body.appendChild(link);
  link.click();
  link.remove();
  // Give the browser a moment to start the download before the address is released.
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
