/** Hands a file to the browser as a download. */
export function saveBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  try {
    const link = document.createElement('a');
    link.href = url;
    link.download = fileName;
    document.body.append(link);
    link.click();
    link.remove();
  } finally {
    // Some browsers read the object URL after click() returns: let it go a little later.
    setTimeout(() => URL.revokeObjectURL(url), 10_000);
  }
}
