/** Hands content to the browser as a download named `fileName`. */
export function saveFile(fileName: string, content: Blob): void {
  const url = URL.createObjectURL(content);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  // Revoked on the next turn: the click has started the download by then.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
