/**
 * Saves text as a file on the clinician's computer. Nothing leaves the browser: the file is
 * made from a Blob in this page (a blob: address of this origin).
 */
export function downloadText(fileName: string, text: string, type: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  // Revoke on a later turn so the download has started in every browser.
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** A file name from an id: "north-hf" → "north-hf.csv". Ids are already safe (lower-case letters, digits, - _ .). */
export function fileNameFor(id: string, extension: string): string {
  return `${id || 'library'}.${extension}`;
}
